// CSV of a fit's marks: where each mark is (pixels and world), where the drag
// model puts the projectile at that time, and the residual between them.
import { marksWithFit } from '../../shared/fits/curves';
import type { FitDetail } from '../../shared/schemas/fits';

export const FIT_CSV_HEADER = ['frame', 't_s', 'u_px', 'v_px', 'x_m', 'y_m', 'fit_x_m', 'fit_y_m', 'residual_x_m', 'residual_y_m', 'outlier'];

export function fitMarksCsv(fit: FitDetail): string {
  const withFit = marksWithFit(fit.result, fit.snapshot.fitInput.marks, fit.snapshot.fitInput.gravityMps2);
  const byTime = new Map(fit.snapshot.marks.map((m) => [m.tS, m]));
  const lines = [FIT_CSV_HEADER.join(',')];
  for (const m of withFit) {
    const px = byTime.get(m.tS);
    lines.push(
      [px?.frameNumber ?? '', m.tS, px?.uPx ?? '', px?.vPx ?? '', m.xM, m.yM, m.fittedXM, m.fittedYM, m.xResidualM, m.yResidualM, m.outlier ? 1 : 0].join(','),
    );
  }
  return `${lines.join('\n')}\n`;
}
