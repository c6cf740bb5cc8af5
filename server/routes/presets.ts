import type { Request, Response } from 'express';
import { CAN } from '../../shared/roles';
import { TeamParams } from '../../shared/schemas/common';
import {
  FitCandidateList,
  FitPresetComparisonList,
  ForecastResponseSchema,
  KeepOutResponseSchema,
  MeasuredVsForecastResponseSchema,
  PoolPreviewSchema,
  PresetDetailSchema,
  PresetList,
  PresetVersionDiffSchema,
  PresetVersionSchema,
  RecordedComparisons,
} from '../../shared/schemas/preset-responses';
import {
  FitComparisonsParams,
  ForecastBody,
  KeepOutQuery,
  PoolPreviewBody,
  PresetCreateBody,
  PresetParams,
  PresetVersionParams,
  PresetVersionQuery,
  PublishVersionBody,
  RecordComparisonsBody,
} from '../../shared/schemas/presets';
import type { AppDeps } from '../app-deps';
import { signedIn, teamRole } from '../auth/access';
import { actorOf, currentTeam, input } from '../http/input';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { forecastFromVersion, measuredVsForecast, presetKeepOut } from '../presets/forecasts';
import {
  createPresetDetail,
  fitPresetComparisonList,
  presetCandidates,
  presetVersion,
  previewPool,
  publishPresetVersion,
  recordComparisons,
} from '../presets/preset-service';
import { presetDetail, presetList } from '../presets/preset-store';

/**
 * Design presets: versioned Cd and launcher efficiency for a launcher and
 * projectile, pooled from approved fits, and the forecasts and keep-out
 * distance built on them. Versions are immutable; publishing adds one.
 */
export function presetRoutes(api: RouteTable, { db }: AppDeps) {
  const base = '/api/teams/:teamId/presets';
  const one = `${base}/:presetId`;
  api.get(base, { summary: 'The team’s design presets with their latest version', response: PresetList }, signedIn, teamRole(CAN.read), validate({ params: TeamParams }), list);
  api.post(base, { summary: 'Create a preset; version 1 starts from a handbook Cd and a stated efficiency assumption', status: 201, response: PresetDetailSchema }, signedIn, teamRole(CAN.editPresets), validate({ params: TeamParams, body: PresetCreateBody }), create);
  api.get(one, { summary: 'One preset with its launcher, projectile and every version with provenance and diffs', response: PresetDetailSchema }, signedIn, teamRole(CAN.read), validate({ params: PresetParams }), getOne);
  api.get(`${one}/candidates`, { summary: 'Approved fits of the preset’s launcher and projectile, with what each would contribute', response: FitCandidateList }, signedIn, teamRole(CAN.read), validate({ params: PresetParams }), candidates);
  api.post(`${one}/pool-preview`, { summary: 'Pool chosen approved fits without publishing: pooled values and heterogeneity', response: PoolPreviewSchema }, signedIn, teamRole(CAN.editPresets), validate({ params: PresetParams, body: PoolPreviewBody }), poolPreview);
  api.post(`${one}/versions`, { summary: 'Publish a new version pooled from approved fits', status: 201, response: PresetVersionSchema }, signedIn, teamRole(CAN.editPresets), validate({ params: PresetParams, body: PublishVersionBody }), publish);
  api.get(`${one}/versions/:version`, { summary: 'One version, however old', response: PresetVersionSchema }, signedIn, teamRole(CAN.read), validate({ params: PresetVersionParams }), getVersion);
  api.get(`${one}/versions/:version/diff`, { summary: 'What changed from the previous version', response: PresetVersionDiffSchema }, signedIn, teamRole(CAN.read), validate({ params: PresetVersionParams }), getDiff);
  api.post(`${one}/versions/:version/comparisons`, { summary: 'Record that approved fits were compared against this version', status: 201, response: RecordedComparisons }, signedIn, teamRole(CAN.review), validate({ params: PresetVersionParams, body: RecordComparisonsBody }), compare);
  api.get(`${one}/keep-out`, { summary: 'Keep-out distance: worst-case range at maximum working pressure times the safety factor, beside the vacuum ceiling', response: KeepOutResponseSchema }, signedIn, teamRole(CAN.read), validate({ params: PresetParams, query: KeepOutQuery }), keepOut);
  api.get(`${one}/measured-vs-forecast`, { summary: 'Measured speed and tape range of the preset’s approved shots against its forecast', response: MeasuredVsForecastResponseSchema }, signedIn, teamRole(CAN.read), validate({ params: PresetParams, query: PresetVersionQuery }), measuredAgainstForecast);
  api.post('/api/teams/:teamId/forecast', { summary: 'Forecast a shot from a preset version and the day’s conditions', response: ForecastResponseSchema }, signedIn, teamRole(CAN.read), validate({ params: TeamParams, body: ForecastBody }), forecast);
  api.get('/api/teams/:teamId/fits/:fitId/preset-comparisons', { summary: 'Preset versions a fit went into or was compared against', response: FitPresetComparisonList }, signedIn, teamRole(CAN.read), validate({ params: FitComparisonsParams }), fitComparisons);

  async function list(_req: Request, res: Response) {
    res.json(await presetList(db, currentTeam(res).id));
  }

  async function create(_req: Request, res: Response) {
    const { body } = input(res, { body: PresetCreateBody });
    res.status(201).json(await createPresetDetail(db, actorOf(res), body));
  }

  async function getOne(_req: Request, res: Response) {
    const { params } = input(res, { params: PresetParams });
    res.json(await presetDetail(db, currentTeam(res).id, params.presetId));
  }

  async function candidates(_req: Request, res: Response) {
    const { params } = input(res, { params: PresetParams });
    res.json(await presetCandidates(db, currentTeam(res).id, params.presetId));
  }

  async function poolPreview(_req: Request, res: Response) {
    const { params, body } = input(res, { params: PresetParams, body: PoolPreviewBody });
    res.json(await previewPool(db, currentTeam(res).id, params.presetId, body.fitIds));
  }

  async function publish(_req: Request, res: Response) {
    const { params, body } = input(res, { params: PresetParams, body: PublishVersionBody });
    res.status(201).json(await publishPresetVersion(db, actorOf(res), params.presetId, body));
  }

  async function getVersion(_req: Request, res: Response) {
    const { params } = input(res, { params: PresetVersionParams });
    res.json(await presetVersion(db, currentTeam(res).id, params.presetId, params.version));
  }

  async function getDiff(_req: Request, res: Response) {
    const { params } = input(res, { params: PresetVersionParams });
    res.json((await presetVersion(db, currentTeam(res).id, params.presetId, params.version)).diff);
  }

  async function compare(_req: Request, res: Response) {
    const { params, body } = input(res, { params: PresetVersionParams, body: RecordComparisonsBody });
    res.status(201).json(await recordComparisons(db, actorOf(res), params.presetId, params.version, body.fitIds));
  }

  async function forecast(_req: Request, res: Response) {
    const { body } = input(res, { body: ForecastBody });
    res.json(await forecastFromVersion(db, currentTeam(res).id, body));
  }

  async function keepOut(_req: Request, res: Response) {
    const { params, query } = input(res, { params: PresetParams, query: KeepOutQuery });
    res.json(await presetKeepOut(db, currentTeam(res).id, params.presetId, query));
  }

  async function measuredAgainstForecast(_req: Request, res: Response) {
    const { params, query } = input(res, { params: PresetParams, query: PresetVersionQuery });
    res.json(await measuredVsForecast(db, currentTeam(res).id, params.presetId, query.version));
  }

  async function fitComparisons(_req: Request, res: Response) {
    const { params } = input(res, { params: FitComparisonsParams });
    res.json(await fitPresetComparisonList(db, currentTeam(res).id, params.fitId));
  }
}
