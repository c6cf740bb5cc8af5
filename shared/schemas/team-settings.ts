import { z } from 'zod';

/** Team-wide rules an admin sets. */
export const TeamSettings = z.object({
  /** Separation of duties: the person who ran a fit may not approve it. */
  separateFitApproval: z.boolean(),
});
export type TeamSettings = z.infer<typeof TeamSettings>;

export const TeamSettingsBody = TeamSettings.partial().refine((v) => Object.keys(v).length > 0, 'Send at least one setting to change');
export type TeamSettingsBody = z.infer<typeof TeamSettingsBody>;

/** Why the approve button is off for the person who ran the fit; also the 403's detail. */
export const OWN_FIT_APPROVAL_REASON =
  'You ran this fit, and this team requires a second person to approve it (separation of duties). Another engineer or an admin can approve it; you may still reject it.';
