// Stage 4 of fitShot: the flow regime along the fitted flight (Reynolds and
// Mach numbers), which says whether one constant Cd can describe the shot.
import { speedOfSoundMps, sutherlandViscosityPaS } from '../air';
import { SEA_LEVEL_TEMPERATURE_K } from '../constants';
import { checkFlow, type FlowCheck } from '../derived';
import { launchFromParams } from '../drag-fit';
import { simulateTrajectory } from '../flight';
import type { FitShotInput } from '../types';
import type { FittedModels } from './fit-models';

export function flowChecks(input: FitShotInput, models: FittedModels): FlowCheck {
  const tempK = input.airTemperatureK ?? SEA_LEVEL_TEMPERATURE_K;
  const { drag } = models;
  const path = simulateTrajectory(
    { dragK_perM: models.params.dragK_perM, gravityMps2: models.gravityMps2, windXMps: input.windXMps ?? 0 },
    launchFromParams(drag.fit.params),
    { timesS: models.marks.map((m) => m.tS - drag.tRefS) },
  );
  const speeds = path.points.map((p) => Math.hypot(p.vxMps, p.vyMps));
  return checkFlow({
    speedMinMps: Math.min(...speeds),
    speedMaxMps: Math.max(...speeds),
    diameterM: input.diameterM,
    airDensityKgM3: input.airDensityKgM3,
    viscosityPaS: sutherlandViscosityPaS(tempK),
    speedOfSoundMps: speedOfSoundMps(tempK),
  });
}
