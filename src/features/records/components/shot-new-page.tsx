import { useNavigate, useSearchParams } from 'react-router';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { useCurrentTeam } from '@/lib/use-current-team';
import { useCreateShot } from '@/api/shots/create-shot';
import { LaunchSafetyNote } from './launch-safety-note';
import { ShotForm } from './shot-form';

export function ShotNewPage() {
  const { teamId } = useCurrentTeam();
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const create = useCreateShot(teamId);
  return (
    <div className="flex max-w-4xl flex-col gap-4">
      <PageHeader title="New shot" subtitle="Record the shot first; its clip is uploaded on the next page." />
      <LaunchSafetyNote />
      <Card>
        <ShotForm
          teamId={teamId}
          defaultSeriesId={params.get('seriesId') ?? undefined}
          submitLabel="Save shot"
          onCancel={() => navigate(-1)}
          onSubmit={async (values) => {
            const shot = await create.mutateAsync(values);
            navigate(`/t/${teamId}/shots/${shot.id}`);
          }}
        />
      </Card>
    </div>
  );
}
