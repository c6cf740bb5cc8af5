// LIKE patterns built from user text.

/** Escapes LIKE wildcards so a search for "50%" finds the text "50%", not everything. */
export function escapeLike(text: string): string {
  return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}
