// The team-wide table of shots with the state and headline numbers of each
// shot's latest fit and, beside it, its latest approved fit (often an older
// one: the numbers a preset may use), filtered, sorted and paged in SQL.
import { and, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type { z } from 'zod';
import type { ShotOverviewPage, ShotOverviewQuery, ShotOverviewRow } from '../../shared/schemas/fits';
import type { Db } from '../db/client';
import { escapeLike } from '../db/escape-like';
import { fits } from '../db/schema/fits';
import { refreshStaleness } from './staleness';

type Query = z.output<typeof ShotOverviewQuery>;

// Whitelisted sort expressions (never user text in ORDER BY).
const SORTS: Record<Query['sort'], SQL> = {
  created: sql`s.created_at`,
  label: sql`lower(s.label)`,
  series: sql`lower(ts.name)`,
  speed: sql`latest.launch_speed_mps`,
  cd: sql`latest.drag_coefficient`,
  status: sql`coalesce(latest.state, 'no-fit')`,
};

export async function shotOverview(db: Db, teamId: string, q: Query): Promise<ShotOverviewPage> {
  // Bring states up to date first, so the status filter sees stale fits as stale.
  const pending = await db
    .select({ id: fits.id, trackId: fits.trackId, clipId: fits.clipId, marksRevision: fits.marksRevision, calibrationVersion: fits.calibrationVersion, state: fits.state })
    .from(fits)
    .where(and(eq(fits.teamId, teamId), inArray(fits.state, ['awaiting-review'])));
  if (pending.length > 0) await refreshStaleness(db, pending);

  const where: SQL[] = [sql`s.team_id = ${teamId}`];
  if (q.q) where.push(sql`(s.label ilike ${`%${escapeLike(q.q)}%`} or ts.name ilike ${`%${escapeLike(q.q)}%`})`);
  if (q.seriesId) where.push(sql`s.series_id = ${q.seriesId}`);
  if (q.launcherId) where.push(sql`s.launcher_id = ${q.launcherId}`);
  if (q.projectileId) where.push(sql`s.projectile_id = ${q.projectileId}`);
  if (q.status) where.push(sql`coalesce(latest.state, 'no-fit') = ${q.status}`);
  const whereSql = sql.join(where, sql` and `);
  const dir = q.dir === 'asc' ? sql`asc` : sql`desc`;
  const from = sql`
    from shots s
    join test_series ts on ts.id = s.series_id
    left join launchers l on l.id = s.launcher_id
    left join projectiles p on p.id = s.projectile_id
    left join lateral (
      select f.id, f.state, f.launch_speed_mps, f.drag_coefficient
      from fits f where f.shot_id = s.id order by f.created_at desc limit 1
    ) latest on true
    left join lateral (
      select f.id, f.launch_speed_mps, f.drag_coefficient
      from fits f where f.shot_id = s.id and f.state = 'approved' order by f.created_at desc limit 1
    ) approved on true
    left join lateral (select count(*)::int as n from fits f2 where f2.shot_id = s.id) fc on true
    where ${whereSql}`;

  const offset = (q.page - 1) * q.pageSize;
  const [rows, totals] = await Promise.all([
    db.execute(sql`
      select s.id as "shotId", s.label, s.series_id as "seriesId", ts.name as "seriesName", ts.test_date::text as "testDate",
             l.name as "launcherName", p.name as "projectileName", s.created_at as "createdAt",
             coalesce(latest.state, 'no-fit') as status, latest.id as "fitId",
             latest.launch_speed_mps as "launchSpeedMps", latest.drag_coefficient as "dragCoefficient", fc.n as "fitCount",
             approved.id as "approvedFitId", approved.launch_speed_mps as "approvedSpeedMps", approved.drag_coefficient as "approvedDragCoefficient"
      ${from}
      order by ${SORTS[q.sort]} ${dir} nulls last, s.id
      limit ${q.pageSize} offset ${offset}`),
    db.execute(sql`select count(*)::int as total ${from}`),
  ]);
  const items = (rows.rows as Record<string, unknown>[]).map(
    (r): ShotOverviewRow => ({
      shotId: String(r.shotId),
      label: String(r.label),
      seriesId: String(r.seriesId),
      seriesName: String(r.seriesName),
      testDate: String(r.testDate),
      launcherName: (r.launcherName as string | null) ?? null,
      projectileName: (r.projectileName as string | null) ?? null,
      createdAt: new Date(r.createdAt as string).toISOString(),
      status: r.status as ShotOverviewRow['status'],
      fitId: (r.fitId as string | null) ?? null,
      launchSpeedMps: r.launchSpeedMps === null ? null : Number(r.launchSpeedMps),
      dragCoefficient: r.dragCoefficient === null ? null : Number(r.dragCoefficient),
      fitCount: Number(r.fitCount),
      approved:
        r.approvedFitId === null || r.approvedFitId === undefined
          ? null
          : {
              fitId: String(r.approvedFitId),
              launchSpeedMps: Number(r.approvedSpeedMps),
              dragCoefficient: r.approvedDragCoefficient === null ? null : Number(r.approvedDragCoefficient),
            },
    }),
  );
  return { items, total: Number((totals.rows[0] as { total: number }).total), page: q.page, pageSize: q.pageSize };
}
