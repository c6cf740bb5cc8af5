import { useNavigate, useParams } from 'react-router';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingBlock } from '@/components/ui/spinner';
import { useCurrentTeam } from '@/lib/use-current-team';
import { useShot } from '@/api/shots/get-shot';
import { useUpdateShot } from '@/api/shots/update-shot';
import { ShotForm } from './shot-form';

export function ShotEditPage() {
  const { teamId } = useCurrentTeam();
  const { shotId = '' } = useParams();
  const navigate = useNavigate();
  const shot = useShot(teamId, shotId);
  const update = useUpdateShot(teamId);
  if (shot.isLoading) return <LoadingBlock />;
  if (!shot.data) return <FormError error={shot.error} />;
  return (
    <div className="flex max-w-4xl flex-col gap-4">
      <PageHeader eyebrow={shot.data.seriesName} title={`Edit ${shot.data.label}`} />
      <Card>
        <ShotForm
          teamId={teamId}
          shot={shot.data}
          submitLabel="Save changes"
          onCancel={() => navigate(`/t/${teamId}/shots/${shotId}`)}
          onSubmit={async (values) => {
            await update.mutateAsync({ id: shotId, body: values });
            navigate(`/t/${teamId}/shots/${shotId}`);
          }}
        />
      </Card>
    </div>
  );
}
