import { useMemo } from 'react';
import { fitCurves, finiteDifferenceSpeeds, marksWithFit } from '@shared/fits/curves';
import type { FitDetail } from '@shared/schemas/fits';

/** Everything the plots draw, computed once per fit with the same shared functions the PDF uses. */
export function useFitPlots(fit: FitDetail | undefined) {
  return useMemo(() => {
    if (!fit) return null;
    const input = fit.snapshot.fitInput;
    const curves = fitCurves(fit.result, input.marks, input.gravityMps2);
    return {
      marks: input.marks,
      curves,
      withFit: marksWithFit(fit.result, input.marks, input.gravityMps2),
      markSpeeds: finiteDifferenceSpeeds(input.marks),
    };
  }, [fit]);
}

export type FitPlots = NonNullable<ReturnType<typeof useFitPlots>>;
