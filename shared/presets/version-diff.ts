// What changed between two preset versions, field by field, for the history view.
import type { PresetVersionDiff, PresetVersionDiffRow } from '../schemas/presets';

export interface DiffableVersion {
  version: number;
  dragCoefficient: number;
  dragCoefficientStd: number;
  efficiency: number;
  efficiencyStd: number;
  keepOutSafetyFactor: number;
  launcherModel: string;
  dragSource: string;
  efficiencySource: string;
  pooledFitIds: string[];
}

const NUMERIC: [keyof DiffableVersion, string][] = [
  ['dragCoefficient', 'Drag coefficient'],
  ['dragCoefficientStd', 'Drag coefficient standard uncertainty'],
  ['efficiency', 'Launcher efficiency'],
  ['efficiencyStd', 'Launcher efficiency standard uncertainty'],
  ['keepOutSafetyFactor', 'Keep-out safety factor'],
];
const TEXT: [keyof DiffableVersion, string][] = [
  ['launcherModel', 'Launcher model'],
  ['dragSource', 'Drag source'],
  ['efficiencySource', 'Efficiency source'],
];

/** Rows for every field that changed; against no previous version, every field is "new". */
export function diffVersions(previous: DiffableVersion | null, next: DiffableVersion): PresetVersionDiff {
  const rows: PresetVersionDiffRow[] = [];
  for (const [field, label] of NUMERIC) {
    const after = next[field] as number;
    const before = previous ? (previous[field] as number) : null;
    if (before !== null && before === after) continue;
    rows.push({ field, label, before, after, change: before === null ? null : after - before, relativeChange: before ? (after - before) / before : null });
  }
  for (const [field, label] of TEXT) {
    const after = next[field] as string;
    const before = previous ? (previous[field] as string) : null;
    if (before === after) continue;
    rows.push({ field, label, before, after, change: null, relativeChange: null });
  }
  const prevFits = new Set(previous?.pooledFitIds ?? []);
  const nextFits = new Set(next.pooledFitIds);
  return {
    fromVersion: previous?.version ?? null,
    toVersion: next.version,
    rows,
    fitsAdded: next.pooledFitIds.filter((id) => !prevFits.has(id)),
    fitsRemoved: [...prevFits].filter((id) => !nextFits.has(id)),
  };
}
