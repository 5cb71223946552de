/** Empty stays empty (the schema says it is required); text that is not a number reaches the schema as text. */
export function toNumber(value: unknown): unknown {
  if (typeof value !== 'string') return value;
  const trimmed = value.trim().replace(',', '.');
  if (trimmed === '') return undefined;
  const number = Number(trimmed);
  return Number.isFinite(number) ? number : trimmed;
}
