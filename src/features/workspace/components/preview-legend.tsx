import { PREVIEW_MIN_MARKS, type FlightPreview } from '../editor/flight-preview';
import { formatNumber } from '@/lib/format';

/** Says what the curves on the frame are, and why they may be missing. */
export function PreviewLegend({ preview, markCount, calibrated }: { preview: FlightPreview | null; markCount: number; calibrated: boolean }) {
  let note: string | null = null;
  if (!calibrated) note = 'Curves appear once the clip has a scale and an origin.';
  else if (markCount < PREVIEW_MIN_MARKS) note = `Curves appear from ${PREVIEW_MIN_MARKS} marks (${markCount} so far).`;
  return (
    <div className="rounded-card border border-line bg-paper-raised px-4 py-3 text-micro text-ink-soft">
      <p className="mb-1 font-semibold uppercase tracking-wide text-ink-faint">Live preview</p>
      {note ?? (
        <ul className="flex flex-col gap-1">
          <li className="flex items-center gap-2">
            <svg width="28" height="6" aria-hidden><line x1="0" y1="3" x2="28" y2="3" stroke="#1f7a72" strokeWidth="2" /></svg>
            {/* "Not converged" only when a preview exists and its drag fit failed; while the worker is still fitting, say that. */}
            Drag fit{preview?.drag ? ` (k ≈ ${formatNumber(preview.drag.dragK_perM, { digits: 2 })} /m)` : preview ? ' — not converged yet' : ' — fitting…'}
          </li>
          <li className="flex items-center gap-2">
            <svg width="28" height="6" aria-hidden><line x1="0" y1="3" x2="28" y2="3" stroke="#7a6fa8" strokeWidth="2" strokeDasharray="5 3" /></svg>
            Drag-free fit
          </li>
          <li>{preview && !preview.dragFree.next ? 'The last frame of the clip is marked: no next frame to predict.' : 'Crosshairs: where each fit expects the projectile on the next frame.'}</li>
        </ul>
      )}
      <p className="mt-1 text-ink-faint">A preview only; the reviewed fit uses the projectile’s mass, size and the air on the day.</p>
    </div>
  );
}
