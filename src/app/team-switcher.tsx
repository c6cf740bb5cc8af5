import { useNavigate } from 'react-router';
import { ROLE_LABELS } from '@shared/roles';
import type { TeamMembership } from '@/api/me/get-me';

export interface TeamSwitcherProps {
  teams: readonly TeamMembership[];
  currentTeamId: string | undefined;
}

/** Changing team goes to that team's home: ids of shots and series differ per team. */
export function TeamSwitcher({ teams, currentTeamId }: TeamSwitcherProps) {
  const navigate = useNavigate();
  if (teams.length === 0) return null;
  return (
    <label className="flex items-center gap-2 text-micro text-paper/70">
      <span className="uppercase tracking-wider">Team</span>
      <select
        value={currentTeamId ?? ''}
        onChange={(e) => navigate(`/t/${e.target.value}`)}
        className="h-8 max-w-80 rounded-md border border-paper/20 bg-ink-soft/60 px-2 text-body text-paper hover:border-paper/40"
      >
        {!currentTeamId && <option value="">Choose a team…</option>}
        {teams.map((t) => (
          <option key={t.id} value={t.id} className="bg-paper-raised text-ink">
            {t.name} ({ROLE_LABELS[t.role]})
          </option>
        ))}
      </select>
    </label>
  );
}
