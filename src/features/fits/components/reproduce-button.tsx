import { Button } from '@/components/ui/button';
import { errorMessage } from '@/components/ui/form-error';
import { useReproduceFit } from '@/api/fits/reproduce-fit';

/** Recompute the fit on the server from its stored inputs and say whether every number came out the same. */
export function ReproduceButton({ teamId, fitId }: { teamId: string; fitId: string }) {
  const reproduce = useReproduceFit(teamId, fitId);
  const r = reproduce.data;
  return (
    <div className="flex flex-wrap items-center gap-2">
      <Button size="sm" onClick={() => reproduce.mutate()} busy={reproduce.isPending}>
        Recompute from stored inputs
      </Button>
      <span role="status" className="text-micro">
        {r && r.identical && r.inputHashMatches && <span className="text-fit-dark">Identical: every number reproduced bit for bit.</span>}
        {r && !(r.identical && r.inputHashMatches) && (
          <span className="text-alert">Differs{r.inputHashMatches ? '' : ' (input hash mismatch)'}: {r.differences.slice(0, 5).join(', ')}</span>
        )}
        {reproduce.error && <span className="text-alert">{errorMessage(reproduce.error)}</span>}
      </span>
    </div>
  );
}
