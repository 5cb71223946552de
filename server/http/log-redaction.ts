/**
 * What the log must never hold: session cookies, CSRF tokens, passwords, one-time codes and the
 * tokens of reset and invitation links. Paths for pino's redact option (any depth we log at),
 * plus a rewrite of URLs, where invitation and reset tokens travel in the path or query.
 */
export const secretKeys = [
  'password',
  'currentPassword',
  'newPassword',
  'token',
  'csrfToken',
  'code',
  'recoveryCode',
  'recoveryCodes',
  'secret',
];

/** Request and response headers that carry secrets (node gives header names in lower case). */
export const secretHeaders = ['cookie', 'x-csrf-token', 'authorization', 'set-cookie'];

/** What a redacted value reads as. */
export const redactedValue = '[Redacted]';

export const logRedactPaths = [
  'req.headers.cookie',
  'req.headers["x-csrf-token"]',
  'req.headers.authorization',
  'res.headers["set-cookie"]',
  'headers.cookie',
  'headers["x-csrf-token"]',
  ...secretKeys.flatMap((key) => [key, `*.${key}`, `*.*.${key}`, `req.body.${key}`]),
];

const urlSecrets: Array<[RegExp, string]> = [
  [/(\/invitations\/)[^/?#]+/g, '$1[Redacted]'],
  [/([?&](?:token|code)=)[^&#]*/g, '$1[Redacted]'],
];

export function redactUrl(url: string): string {
  return urlSecrets.reduce((text, [pattern, replacement]) => text.replace(pattern, replacement), url);
}
