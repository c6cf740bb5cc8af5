import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useNavigate } from 'react-router';
import { TeamCreateBody } from '@shared/schemas/teams';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { TextField } from '@/components/ui/text-field';
import { useCreateTeam } from '@/api/teams/create-team';

export function CreateTeamForm() {
  const navigate = useNavigate();
  const create = useCreateTeam();
  const form = useForm({ resolver: zodResolver(TeamCreateBody), defaultValues: { name: '', siteName: '' } });
  const { errors } = form.formState;
  const onSubmit = form.handleSubmit(({ name, siteName }) =>
    create.mutate({ name, siteName: siteName || undefined }, { onSuccess: (team) => navigate(`/t/${team.id}`) }),
  );
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
      <TextField label="Team name" required autoComplete="organization" hint="Usually the company, lab or programme." error={errors.name?.message} {...form.register('name')} />
      <TextField label="Test site" hint="Where you shoot, e.g. the field or range name. Optional." error={errors.siteName?.message} {...form.register('siteName')} />
      <FormError error={create.error} hideFields={['name', 'siteName']} />
      <div>
        <Button type="submit" variant="primary" busy={create.isPending}>
          Create team
        </Button>
      </div>
    </form>
  );
}
