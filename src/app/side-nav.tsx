import { NavLink } from 'react-router';
import { ROLE_LABELS } from '@shared/roles';
import { cx } from '@/components/ui/cx';
import type { TeamMembership } from '@/api/me/get-me';
import { navEntriesFor, type NavEntry } from './nav';

const linkClass = ({ isActive }: { isActive: boolean }) =>
  cx(
    'block rounded-md border-l-[3px] px-3 py-1.5 text-body',
    isActive ? 'border-signal bg-paper-raised font-medium text-ink shadow-sm' : 'border-transparent text-ink-soft hover:bg-paper-raised/60 hover:text-ink',
  );

/** The team's pages (filtered by my role), then my own pages. */
export function SideNav({ team }: { team: TeamMembership | undefined }) {
  return (
    <nav aria-label="Main" className="flex flex-col gap-5 py-5 pr-3 pl-4">
      {team && (
        <div>
          <div className="mb-2 px-3">
            <p className="truncate text-body font-semibold text-ink" title={team.name}>
              {team.name}
            </p>
            {team.siteName && (
              <p className="truncate text-micro text-ink-faint" title={team.siteName}>
                {team.siteName}
              </p>
            )}
            <p className="mt-1 text-micro text-ink-soft">
              You: <span className="font-medium text-signal-dark">{ROLE_LABELS[team.role]}</span>
            </p>
          </div>
          <NavList entries={navEntriesFor(team.role).filter((e) => e.section !== 'team')} teamId={team.id} />
        </div>
      )}
      {team && navEntriesFor(team.role).some((e) => e.section === 'team') && (
        <div>
          <p className="mb-1 px-3 text-micro font-medium uppercase tracking-wider text-ink-faint">Team</p>
          <NavList entries={navEntriesFor(team.role).filter((e) => e.section === 'team')} teamId={team.id} />
        </div>
      )}
      <div>
        <p className="mb-1 px-3 text-micro font-medium uppercase tracking-wider text-ink-faint">You</p>
        <ul className="flex flex-col gap-0.5">
          <li>
            <NavLink to="/mail" className={linkClass}>
              My mail
            </NavLink>
          </li>
          <li>
            <NavLink to="/settings" className={linkClass}>
              Settings
            </NavLink>
          </li>
        </ul>
      </div>
    </nav>
  );
}

function NavList({ entries, teamId }: { entries: NavEntry[]; teamId: string }) {
  return (
    <ul className="flex flex-col gap-0.5">
      {entries.map((entry) => (
        <li key={entry.label}>
          <NavLink to={entry.to(teamId)} end={entry.end} className={linkClass}>
            {entry.label}
          </NavLink>
        </li>
      ))}
    </ul>
  );
}
