import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { ROLES, ROLE_DUTIES, ROLE_LABELS, type Role } from '@shared/roles';
import { InvitationCreateBody } from '@shared/schemas/teams';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { InlineStatus } from '@/components/ui/inline-status';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { formatDate } from '@/lib/format';
import { useCreateInvitation } from '@/api/invitations/create-invitation';

const ROLE_OPTIONS = ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));

export function InviteForm({ teamId }: { teamId: string }) {
  const invite = useCreateInvitation(teamId);
  const [sent, setSent] = useState<string | null>(null);
  // Least privilege by default: a new person starts as a viewer unless chosen otherwise.
  const form = useForm({ resolver: zodResolver(InvitationCreateBody), defaultValues: { email: '', role: 'viewer' as Role } });
  const { errors } = form.formState;
  const role = form.watch('role');

  const onSubmit = form.handleSubmit((body) => {
    setSent(null);
    invite.mutate(body, {
      onSuccess: (invitation) => {
        setSent(`Invitation sent to ${invitation.email}. The link works until ${formatDate(invitation.expiresAt)}.`);
        form.reset({ email: '', role: body.role });
      },
    });
  });

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
      <TextField label="E-mail" type="email" autoComplete="off" error={errors.email?.message} {...form.register('email')} />
      <SelectField label="Role" options={ROLE_OPTIONS} error={errors.role?.message} {...form.register('role')} />
      <p className="text-micro text-ink-soft">
        <span className="font-medium text-ink">{ROLE_LABELS[role]}:</span> {ROLE_DUTIES[role]}
      </p>
      <FormError error={invite.error} hideFields={['email', 'role']} />
      {sent && <InlineStatus tone="ok">{sent}</InlineStatus>}
      <div>
        <Button type="submit" variant="primary" busy={invite.isPending}>
          Send invitation
        </Button>
      </div>
    </form>
  );
}
