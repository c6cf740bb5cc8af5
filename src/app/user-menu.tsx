import { useEffect, useId, useRef, useState } from 'react';
import { Link, useNavigate } from 'react-router';
import type { Me } from '@shared/schemas/auth';
import { useSignOut } from '@/api/auth/sign-out';

function initials(name: string): string {
  const parts = name.trim().split(/\s+/);
  return ((parts[0]?.[0] ?? '') + (parts.length > 1 ? parts[parts.length - 1][0] : '')).toUpperCase() || '?';
}

/**
 * A disclosure (button + panel of links), not an ARIA menu: plain links and
 * Tab order are easier to use with a keyboard than a roving menu for 3 items.
 */
export function UserMenu({ me }: { me: Me }) {
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const root = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);
  const navigate = useNavigate();
  const signOut = useSignOut();

  useEffect(() => {
    if (!open) return;
    const onPointer = (e: PointerEvent) => {
      if (!root.current?.contains(e.target as Node)) setOpen(false);
    };
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape') {
        setOpen(false);
        button.current?.focus();
      }
    };
    document.addEventListener('pointerdown', onPointer);
    document.addEventListener('keydown', onKey);
    return () => {
      document.removeEventListener('pointerdown', onPointer);
      document.removeEventListener('keydown', onKey);
    };
  }, [open]);

  const itemClass = 'block w-full rounded-md px-3 py-1.5 text-left text-body text-ink hover:bg-paper-sunk';

  return (
    <div ref={root} className="relative">
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((v) => !v)}
        className="flex items-center gap-2 rounded-md px-1.5 py-1 text-body text-paper hover:bg-ink-soft/60"
      >
        <span aria-hidden className="grid size-7 place-items-center rounded-full bg-signal text-micro font-semibold text-ink">
          {initials(me.displayName)}
        </span>
        <span className="hidden sm:inline">{me.displayName}</span>
        <span aria-hidden className="text-[10px] text-paper/60">
          ▾
        </span>
      </button>
      {open && (
        <div id={panelId} className="absolute right-0 z-20 mt-1 w-64 rounded-card border border-line bg-paper-raised p-1.5 shadow-lg">
          <div className="border-b border-line px-3 pt-1 pb-2">
            <p className="text-body font-medium text-ink">{me.displayName}</p>
            <p className="truncate text-micro text-ink-faint">{me.email}</p>
          </div>
          <ul className="pt-1">
            <li>
              <Link to="/mail" className={itemClass} onClick={() => setOpen(false)}>
                My mail
              </Link>
            </li>
            <li>
              <Link to="/settings" className={itemClass} onClick={() => setOpen(false)}>
                My settings
              </Link>
            </li>
            <li>
              <button
                type="button"
                className={itemClass}
                disabled={signOut.isPending}
                onClick={() => signOut.mutate(undefined, { onSettled: () => navigate('/sign-in', { replace: true }) })}
              >
                Sign out
              </button>
            </li>
          </ul>
        </div>
      )}
    </div>
  );
}
