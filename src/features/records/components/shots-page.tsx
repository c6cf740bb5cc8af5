import { useEffect, useState } from 'react';
import { CAN } from '@shared/roles';
import { Button } from '@/components/ui/button';
import { ButtonLink } from '@/components/ui/button-link';
import { FormError } from '@/components/ui/form-error';
import { PageHeader } from '@/components/ui/page-header';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useCurrentTeam } from '@/lib/use-current-team';
import { useLaunchers } from '@/api/launchers/list-launchers';
import { useProjectiles } from '@/api/projectiles/list-projectiles';
import { useSeriesList } from '@/api/series/list-series';
import { useShots } from '@/api/shots/list-shots';
import { useShotListParams } from '../hooks/use-shot-list-params';
import { ShotsTable } from './shots-table';

/** Every shot of the team, paged, sorted and filtered by the server. */
export function ShotsPage() {
  const { teamId, can } = useCurrentTeam();
  const { query, update } = useShotListParams();
  const shots = useShots(teamId, query);
  const series = useSeriesList(teamId);
  const launchers = useLaunchers(teamId);
  const projectiles = useProjectiles(teamId);
  const [text, setText] = useState(query.q ?? '');

  // Search as the person pauses typing, not on every key.
  useEffect(() => {
    const timer = setTimeout(() => {
      if ((query.q ?? '') !== text.trim()) update({ q: text.trim() });
    }, 350);
    return () => clearTimeout(timer);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- debounce on text only
  }, [text]);

  const page = shots.data;
  const pages = page ? Math.max(1, Math.ceil(page.total / page.pageSize)) : 1;
  const newShotHref = `/t/${teamId}/shots/new${query.seriesId ? `?seriesId=${query.seriesId}` : ''}`;

  return (
    <div>
      <PageHeader
        title="Shots"
        subtitle="Every shot the team recorded, with its conditions and the state of its clip."
        actions={can(CAN.editShots) && <ButtonLink to={newShotHref} variant="primary">New shot</ButtonLink>}
      />
      <div className="mb-4 grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <SelectField
          label="Series"
          placeholder="All series"
          value={query.seriesId ?? ''}
          onChange={(e) => update({ seriesId: e.target.value })}
          options={(series.data ?? []).map((s) => ({ value: s.id, label: s.name }))}
        />
        <SelectField
          label="Launcher"
          placeholder="All launchers"
          value={query.launcherId ?? ''}
          onChange={(e) => update({ launcherId: e.target.value })}
          options={(launchers.data ?? []).map((l) => ({ value: l.id, label: l.name }))}
        />
        <SelectField
          label="Projectile"
          placeholder="All projectiles"
          value={query.projectileId ?? ''}
          onChange={(e) => update({ projectileId: e.target.value })}
          options={(projectiles.data ?? []).map((p) => ({ value: p.id, label: p.name }))}
        />
        <TextField label="Search" type="search" placeholder="Label, notes, names…" value={text} onChange={(e) => setText(e.target.value)} />
      </div>
      <FormError error={shots.error} className="mb-4" />
      <ShotsTable
        teamId={teamId}
        shots={page?.items ?? []}
        loading={shots.isLoading}
        sort={query.sort ?? 'created'}
        dir={query.dir ?? 'desc'}
        onSortChange={(sort, dir) => update({ sort, dir })}
      />
      {page && page.total > 0 && (
        <nav aria-label="Pages" className="mt-2 flex items-center justify-between gap-4 text-micro text-ink-soft">
          <span className="tabular-nums">
            {(page.page - 1) * page.pageSize + 1}–{Math.min(page.total, page.page * page.pageSize)} of {page.total}
          </span>
          <div className="flex items-center gap-2">
            <Button size="sm" disabled={page.page <= 1} onClick={() => update({ page: page.page - 1 })}>
              Previous
            </Button>
            <span className="tabular-nums">
              Page {page.page} of {pages}
            </span>
            <Button size="sm" disabled={page.page >= pages} onClick={() => update({ page: page.page + 1 })}>
              Next
            </Button>
          </div>
        </nav>
      )}
    </div>
  );
}
