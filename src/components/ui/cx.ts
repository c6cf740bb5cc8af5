// Joins class names, skipping the falsy ones, so conditional styling stays readable.
export function cx(...parts: (string | false | null | undefined)[]): string {
  return parts.filter(Boolean).join(' ');
}
