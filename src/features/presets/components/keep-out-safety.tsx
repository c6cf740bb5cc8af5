import { SafetyNote } from '@/components/ui/safety-note';

/** The cautions every keep-out figure and forecast carries. Never behind a toggle (DEVELOPERS.md, Safety). */
export function KeepOutSafety() {
  return (
    <SafetyNote>
      <p className="font-medium">
        This is an estimate for planning, not a substitute for range-safety rules, local codes or licensed practice. Pressure vessels must be rated and inspected.
      </p>
      <p>Never charge a launcher above its maximum working pressure. Keep the downrange area clear and controlled: ricochets, gusts, a burst line or a failed valve can carry a projectile outside any forecast.</p>
    </SafetyNote>
  );
}
