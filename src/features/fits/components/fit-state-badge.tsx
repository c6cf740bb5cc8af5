import { FIT_STATE_LABELS, type FitState } from '@shared/schemas/fits';
import { Badge, type BadgeTone } from '@/components/ui/badge';

const TONES: Record<FitState, BadgeTone> = {
  'awaiting-review': 'signal',
  approved: 'fit',
  rejected: 'alert',
  stale: 'neutral',
};

export function FitStateBadge({ state, inputsChanged = false }: { state: FitState; inputsChanged?: boolean }) {
  return (
    <span className="inline-flex items-center gap-1">
      <Badge tone={TONES[state]}>{FIT_STATE_LABELS[state]}</Badge>
      {inputsChanged && state !== 'stale' && (
        <Badge tone="neutral" title="The marks or the calibration changed after this fit ran">
          inputs changed since {state === 'awaiting-review' ? 'the fit' : 'review'}
        </Badge>
      )}
    </span>
  );
}
