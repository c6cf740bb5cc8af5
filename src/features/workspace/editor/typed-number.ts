/** A number as typed into a field: decimal comma and the typographic minus read as usual; empty is not a number. */
export const parseTyped = (text: string) => (text.trim() === '' ? Number.NaN : Number(text.trim().replace(',', '.').replace('\u2212', '-')));
