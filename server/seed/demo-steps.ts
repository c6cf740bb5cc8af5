import { demoClipsStep } from './demo-clips';
import { demoFitsStep } from './demo-fits';
import { demoRecordsStep } from './demo-records';
import { demoPresetsStep } from './demo-presets';
import type { SeedStep } from './seed-demo';

/** Demo data beyond the team and its people, in the order it is seeded. Areas append their steps here. */
export const DEMO_STEPS: SeedStep[] = [demoRecordsStep, demoClipsStep, demoFitsStep, demoPresetsStep];
