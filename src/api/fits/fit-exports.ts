import { fitPath } from '@/api/api-paths';

/** The fit's downloads are plain attachments, so a link is all the client needs. */
export type FitExport = 'export.csv' | 'export.json' | 'report.pdf';

export const fitExportUrl = (teamId: string, fitId: string, file: FitExport) => fitPath(teamId, fitId, `/${file}`);
