/** A zod refinement: the confirmation entry must equal the password it repeats. */
export function sameTwice<T extends { confirm: string }>(field: Exclude<keyof T, 'confirm'>) {
  const check = (values: T) => values[field] === values.confirm;
  return [check, { message: 'The two entries differ.', path: ['confirm'] }] as [
    typeof check,
    { message: string; path: string[] },
  ];
}
