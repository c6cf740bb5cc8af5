import { useSearchParams } from 'react-router';
import { SHOT_SORTS, type ShotListQuery, type ShotSort } from '@shared/schemas/records';

export const SHOTS_PAGE_SIZE = 25;

/**
 * The shot list's page, sort and filters live in the URL, so a filtered view
 * can be bookmarked, shared, or linked from a series ("its shots").
 */
export function useShotListParams() {
  const [params, setParams] = useSearchParams();
  const sortParam = params.get('sort');
  const sort: ShotSort = SHOT_SORTS.includes(sortParam as ShotSort) ? (sortParam as ShotSort) : 'created';
  const query: ShotListQuery = {
    page: Math.max(1, Number(params.get('page')) || 1),
    pageSize: SHOTS_PAGE_SIZE,
    sort,
    dir: params.get('dir') === 'asc' ? 'asc' : 'desc',
    seriesId: params.get('seriesId') || undefined,
    launcherId: params.get('launcherId') || undefined,
    projectileId: params.get('projectileId') || undefined,
    q: params.get('q') || undefined,
  };

  /** Changing a filter or the sort goes back to page 1; only paging keeps it. */
  function update(changes: Partial<Record<'page' | 'sort' | 'dir' | 'seriesId' | 'launcherId' | 'projectileId' | 'q', string | number | undefined>>) {
    setParams(
      (current) => {
        const next = new URLSearchParams(current);
        for (const [key, value] of Object.entries(changes)) {
          if (value === undefined || value === '') next.delete(key);
          else next.set(key, String(value));
        }
        if (!('page' in changes)) next.delete('page');
        return next;
      },
      { replace: true },
    );
  }

  return { query, update };
}
