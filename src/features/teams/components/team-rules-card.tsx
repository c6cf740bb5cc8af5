import { CheckboxField } from '@/components/ui/checkbox-field';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { useTeamSettings } from '@/api/team-settings/get-team-settings';
import { useUpdateTeamSettings } from '@/api/team-settings/update-team-settings';

/** Team rules an admin sets; saved as soon as a box changes. */
export function TeamRulesCard({ teamId, canChange }: { teamId: string; canChange: boolean }) {
  const settings = useTeamSettings(teamId);
  const update = useUpdateTeamSettings(teamId);
  return (
    <Card title="Team rules">
      <FormError error={settings.error ?? update.error} />
      {settings.data && (
        <CheckboxField
          label="A second person approves each fit"
          hint="Separation of duties: whoever ran a fit may not approve it. Recommended; turn off only for a team of one engineer."
          checked={settings.data.separateFitApproval}
          disabled={!canChange || update.isPending}
          onChange={(e) => update.mutate({ separateFitApproval: e.target.checked })}
        />
      )}
    </Card>
  );
}
