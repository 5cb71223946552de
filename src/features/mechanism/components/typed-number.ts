/** A number as typed (a decimal comma read as a point); an empty or unreadable entry goes as NaN, sent as null, so the server names the field. */
export const typedNumber = (text: string) => (text.trim() === '' ? Number.NaN : Number(text.replace(',', '.')));
