import type { MarksCsvKind } from '@shared/schemas/marking';
import { trackPath } from '@/api/api-paths';

/** The export is a plain download (text/csv attachment), so a link is all the client needs. */
export const exportMarksUrl = (teamId: string, trackId: string, kind: MarksCsvKind) =>
  `${trackPath(teamId, trackId)}/marks/export?kind=${kind}`;
