import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { CreateTeamForm } from './create-team-form';

/** For a signed-in person who belongs to no team yet. */
export function NoTeamPage() {
  return (
    <div className="max-w-xl">
      <PageHeader title="No team yet" subtitle="Arcbench keeps shots, fits and presets per team. Start one, or ask a team's admin to invite you." />
      <Card title="Start a team" subtitle="You will be its admin and can invite the others.">
        <CreateTeamForm />
      </Card>
    </div>
  );
}
