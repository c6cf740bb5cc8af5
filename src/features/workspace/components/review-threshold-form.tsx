import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { TextField } from '@/components/ui/text-field';
import { useUpdateAutoMarkSettings } from '@/api/auto-mark/update-auto-mark-settings';

/** The team's review threshold, for those who run fits (it decides which automatic marks a fit leaves out). */
export function ReviewThresholdForm({ teamId, threshold }: { teamId: string; threshold: number }) {
  const update = useUpdateAutoMarkSettings(teamId);
  const [percent, setPercent] = useState(String(Math.round(threshold * 100)));
  const [problem, setProblem] = useState<string | null>(null);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const value = Number(percent);
    if (!Number.isFinite(value) || value < 0 || value > 100) {
      setProblem('Give a whole percentage from 0 to 100.');
      return;
    }
    setProblem(null);
    update.mutate({ reviewThreshold: value / 100 });
  };
  return (
    <form onSubmit={submit} className="flex items-end gap-2">
      <TextField label="Review threshold" type="number" min={0} max={100} step={1} suffix="%" value={percent} onChange={(e) => setPercent(e.target.value)} error={problem ?? undefined} fieldClassName="w-36" />
      <Button type="submit" size="sm" busy={update.isPending}>
        Save
      </Button>
      {update.isSuccess && !update.isPending && <span role="status" className="pb-2 text-micro text-ink-faint">Saved for the team.</span>}
      <FormError error={update.error} />
    </form>
  );
}
