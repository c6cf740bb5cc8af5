import { eq } from 'drizzle-orm';
import type { TeamSettings, TeamSettingsBody } from '../../shared/schemas/team-settings';
import { audit } from '../audit';
import type { Actor } from '../auth/actor';
import type { Db, DbOrTx } from '../db/client';
import { teams } from '../db/schema/teams';

export async function teamSettings(db: DbOrTx, teamId: string): Promise<TeamSettings> {
  const [row] = await db.select({ separateFitApproval: teams.separateFitApproval }).from(teams).where(eq(teams.id, teamId));
  return row;
}

/** Changes team rules (admins only, checked by the route) and audits the before and after. */
export async function updateTeamSettings(db: Db, actor: Actor, body: TeamSettingsBody): Promise<TeamSettings> {
  await db.transaction(async (tx) => {
    const before = await teamSettings(tx, actor.teamId);
    await tx.update(teams).set(body).where(eq(teams.id, actor.teamId));
    await audit(tx, { teamId: actor.teamId, actorUserId: actor.userId, action: 'team.settings', targetType: 'team', targetId: actor.teamId, detail: { before, after: { ...before, ...body } } });
  });
  return teamSettings(db, actor.teamId);
}
