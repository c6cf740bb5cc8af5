import { SafetyNote } from '@/components/ui/safety-note';

/** Shown wherever a shot is planned or recorded: these launchers store energy in pressurised vessels and throw things downrange. */
export function LaunchSafetyNote() {
  return (
    <SafetyNote>
      <p>Charge a launcher only within its rated maximum working pressure, with a pressure vessel that is inspected and certified as your local regulations require.</p>
      <p>Clear and watch the downrange area before every shot; nobody stands in front of the muzzle or beside the expected flight path.</p>
      <p>Arcbench records what was done. It does not replace local codes, your site’s range procedure or the judgement of a competent person.</p>
    </SafetyNote>
  );
}
