/**
 * The shared schemas word their messages to follow the field's name ("must be an e-mail address");
 * a message that already stands alone is shown as it is.
 */
export function fieldMessage(label: string, message: string): string {
  return /^[a-z]/.test(message) ? `${label} ${message}.`.replace(/\.\.$/, '.') : message;
}
