import type { Request, Response } from 'express';
import type { Actor } from '../auth/actor';
import { actorOf, currentTeam } from '../http/input';

/** What the handlers need of a team-record service (launchers, projectiles). */
interface RecordService<Row, Values> {
  list(teamId: string): Promise<Row[]>;
  get(teamId: string, id: string): Promise<Row>;
  create(actor: Actor, values: Values): Promise<Row>;
  update(actor: Actor, id: string, changes: Partial<Values>): Promise<Row>;
  remove(actor: Actor, id: string): Promise<void>;
}

/**
 * The five handlers of a team-record resource. `idParam` names the path parameter
 * (`launcherId`, `projectileId`); validation has already run in the route chain.
 */
export function teamRecordHandlers<Row, Values>(service: RecordService<Row, Values>, idParam: string) {
  const idOf = (res: Response): string => (res.locals.input as { params: Record<string, string> }).params[idParam];
  const bodyOf = (res: Response): Values => (res.locals.input as { body: Values }).body;

  return {
    async list(_req: Request, res: Response) {
      res.json(await service.list(currentTeam(res).id));
    },
    async getOne(_req: Request, res: Response) {
      res.json(await service.get(currentTeam(res).id, idOf(res)));
    },
    async create(_req: Request, res: Response) {
      res.status(201).json(await service.create(actorOf(res), bodyOf(res)));
    },
    async update(_req: Request, res: Response) {
      res.json(await service.update(actorOf(res), idOf(res), bodyOf(res)));
    },
    async remove(_req: Request, res: Response) {
      await service.remove(actorOf(res), idOf(res));
      res.status(204).end();
    },
  };
}
