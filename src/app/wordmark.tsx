import { Link } from 'react-router';

/** The arc mark and the name; links home. */
export function Wordmark({ tone = 'light' }: { tone?: 'light' | 'dark' }) {
  return (
    <Link to="/" className="inline-flex items-center gap-2 rounded-md" aria-label="Arcbench home">
      <img src="/arcbench.svg" alt="" className="size-7" />
      <span className={`text-lead font-semibold tracking-tight ${tone === 'light' ? 'text-paper' : 'text-ink'}`}>Arcbench</span>
    </Link>
  );
}
