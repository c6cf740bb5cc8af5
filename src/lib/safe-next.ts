/**
 * The page to return to after signing in, taken from ?next=. Only same-site
 * paths are accepted: "//evil.example" or "https://…" would turn the sign-in
 * page into an open redirect.
 */
export function safeNext(next: string | null | undefined, fallback = '/'): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  if (next.startsWith('/sign-in')) return fallback;
  return next;
}

export function signInPath(next: string): string {
  return next === '/' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(next)}`;
}
