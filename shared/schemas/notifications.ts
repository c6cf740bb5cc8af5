import { z } from 'zod';

// How a person hears that work reached them: not at all, one mail per event,
// or one mail a day listing the day's events.
export const NOTIFICATION_MODES = ['none', 'each', 'digest'] as const;
export const NotificationMode = z.enum(NOTIFICATION_MODES);
export type NotificationMode = z.infer<typeof NotificationMode>;

export const NOTIFICATION_MODE_LABELS: Record<NotificationMode, string> = {
  none: 'No e-mail',
  each: 'One e-mail per event',
  digest: 'One e-mail a day',
};
