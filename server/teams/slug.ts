/** A URL-friendly team handle from its name: lower-case ASCII words joined by hyphens. */
export function slugFromName(name: string): string {
  const base = name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '') // drop accents after decomposition: "Sète" → "sete"
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/(^-+|-+$)/g, '')
    .slice(0, 60)
    .replace(/-+$/g, '');
  return base || 'team';
}

/** Candidates tried in order until one is free: "name", "name-2", "name-3", … */
export function slugCandidate(base: string, attempt: number): string {
  return attempt === 0 ? base : `${base}-${attempt + 1}`;
}
