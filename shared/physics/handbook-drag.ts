// Handbook drag coefficients for sanity checks of a fitted Cd. Each entry
// names its source; "from memory" means recalled from the cited handbook or
// common tables, not re-read, so treat it as +-10 %.

export interface HandbookDragEntry {
  body: string;
  dragCoefficient: number;
  /** Reynolds-number range the value applies to, where it matters. */
  reynoldsRange?: [number, number];
  source: string;
}

export const HANDBOOK_DRAG: readonly HandbookDragEntry[] = [
  {
    body: 'smooth sphere, subcritical',
    dragCoefficient: 0.47,
    reynoldsRange: [1e4, 2e5],
    source: 'Hoerner, Fluid-Dynamic Drag (1965), sphere below the drag crisis',
  },
  {
    body: 'smooth sphere, supercritical',
    dragCoefficient: 0.2,
    reynoldsRange: [5e5, 3e6],
    source: 'Hoerner, Fluid-Dynamic Drag (1965), after the drag crisis (from memory, 0.1-0.2)',
  },
  { body: 'golf ball (dimpled sphere)', dragCoefficient: 0.25, reynoldsRange: [5e4, 2e5], source: 'common tables (from memory)' },
  { body: 'long circular cylinder, cross-flow', dragCoefficient: 1.2, reynoldsRange: [1e4, 2e5], source: 'Hoerner, Fluid-Dynamic Drag (from memory)' },
  { body: 'cube, face on', dragCoefficient: 1.05, source: 'common tables (from memory)' },
  { body: 'flat disc, face on', dragCoefficient: 1.17, source: 'Hoerner, Fluid-Dynamic Drag (from memory)' },
  { body: 'streamlined body of revolution', dragCoefficient: 0.04, source: 'Hoerner, Fluid-Dynamic Drag (from memory)' },
  { body: 'blunt projectile (rule of thumb)', dragCoefficient: 0.5, source: 'common practice' },
];

/** The subcritical smooth-sphere value, used as the typical Cd when scaling the drag fit. */
export const SPHERE_SUBCRITICAL_CD = 0.47;
