import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Link, useNavigate, useParams } from 'react-router';
import { ROLE_DUTIES, ROLE_LABELS } from '@shared/roles';
import { DisplayName, NewPassword } from '@shared/schemas/auth';
import { ApiError } from '@/lib/api-client';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { KeyValueList } from '@/components/ui/key-value-list';
import { LoadingBlock } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useAcceptInvitation } from '@/api/invitations/accept-invitation';
import type { InvitationPreview, InvitationState } from '@shared/schemas/teams';
import { formatDate } from '@/lib/format';
import { useInvitationPreview } from '@/api/invitations/get-invitation-preview';

// A new account names itself, picks a password and types it twice; an
// existing account only proves its password. Both send InvitationAcceptBody.
const NewAccountForm = z
  .object({ displayName: DisplayName, password: NewPassword, passwordAgain: z.string() })
  .refine((v) => v.password === v.passwordAgain, { path: ['passwordAgain'], message: 'does not match the password' });
const ExistingAccountForm = z.object({ password: z.string().min(1, 'is required') });

const CLOSED_STATES: Record<Exclude<InvitationState, 'pending'>, { title: string; body: string }> = {
  expired: { title: 'This invitation has expired', body: 'Invitations are valid for a limited time. Ask the admin who invited you to send a new one.' },
  used: { title: 'This invitation has already been used', body: 'If it was you, sign in with the e-mail address it was sent to.' },
  revoked: { title: 'This invitation was withdrawn', body: 'An admin of the team revoked it. Ask them if you still need access.' },
};

export function AcceptInvitationPage() {
  const { token = '' } = useParams();
  const preview = useInvitationPreview(token);

  if (preview.isPending) return <LoadingBlock label="Checking the invitation…" />;
  if (preview.isError) {
    const missing = preview.error instanceof ApiError && (preview.error.status === 404 || preview.error.status === 400);
    return (
      <Closed
        title={missing ? 'This invitation link is not valid' : 'Could not check the invitation'}
        body={missing ? 'The link may be incomplete. Open it again from the e-mail, or ask for a new invitation.' : undefined}
        error={missing ? undefined : preview.error}
      />
    );
  }
  const invitation = preview.data;
  if (invitation.state !== 'pending') return <Closed {...CLOSED_STATES[invitation.state]} />;

  return (
    <div className="mx-auto w-full max-w-md">
      <p className="mb-1 text-micro font-medium uppercase tracking-wider text-ink-faint">Invitation</p>
      <h1 className="mb-4 text-title">Join {invitation.teamName}</h1>
      <Card className="mb-4">
        <KeyValueList
          items={[
            { label: 'Team', value: invitation.teamName },
            ...(invitation.siteName ? [{ label: 'Test site', value: invitation.siteName }] : []),
            { label: 'For', value: invitation.email },
            { label: 'Role', value: <Badge tone="signal">{ROLE_LABELS[invitation.role]}</Badge> },
            { label: 'Valid until', value: formatDate(invitation.expiresAt) },
          ]}
        />
        <p className="mt-3 text-micro text-ink-soft">{ROLE_DUTIES[invitation.role]}</p>
      </Card>
      <Card title={invitation.accountExists ? 'Confirm it is you' : 'Create your account'}>
        {invitation.accountExists ? <ExistingAccount token={token} invitation={invitation} /> : <NewAccount token={token} invitation={invitation} />}
      </Card>
    </div>
  );
}

function useFinish(token: string, teamName: string) {
  const navigate = useNavigate();
  const accept = useAcceptInvitation(token);
  const submit = (body: { displayName?: string; password: string }) =>
    accept.mutate(body, {
      onSuccess: (me) => {
        const team = me.teams.find((t) => t.name === teamName);
        navigate(team ? `/t/${team.id}` : '/', { replace: true });
      },
    });
  return { accept, submit };
}

function NewAccount({ token, invitation }: { token: string; invitation: InvitationPreview }) {
  const { accept, submit } = useFinish(token, invitation.teamName);
  const form = useForm({ resolver: zodResolver(NewAccountForm), defaultValues: { displayName: '', password: '', passwordAgain: '' } });
  const { errors } = form.formState;
  return (
    <form noValidate className="flex flex-col gap-4" onSubmit={form.handleSubmit(({ displayName, password }) => submit({ displayName, password }))}>
      <input type="email" hidden readOnly autoComplete="username" value={invitation.email} />
      <TextField label="Your name" autoComplete="name" autoFocus hint="Shown to your team beside the work you do." error={errors.displayName?.message} {...form.register('displayName')} />
      <TextField label="Password" type="password" autoComplete="new-password" hint="At least 10 characters. A phrase of a few words works well." error={errors.password?.message} {...form.register('password')} />
      <TextField label="Password again" type="password" autoComplete="new-password" error={errors.passwordAgain?.message} {...form.register('passwordAgain')} />
      <FormError error={accept.error} hideFields={['displayName', 'password']} />
      <Button type="submit" variant="primary" busy={accept.isPending}>
        Create account and join
      </Button>
    </form>
  );
}

function ExistingAccount({ token, invitation }: { token: string; invitation: InvitationPreview }) {
  const { accept, submit } = useFinish(token, invitation.teamName);
  const form = useForm({ resolver: zodResolver(ExistingAccountForm), defaultValues: { password: '' } });
  const { errors } = form.formState;
  return (
    <form noValidate className="flex flex-col gap-4" onSubmit={form.handleSubmit(({ password }) => submit({ password }))}>
      <p className="text-body text-ink-soft">
        {invitation.email} already has an Arcbench account. Enter its password to add {invitation.teamName} to your teams.
      </p>
      <input type="email" hidden readOnly autoComplete="username" value={invitation.email} />
      <TextField label="Password" type="password" autoComplete="current-password" autoFocus error={errors.password?.message} {...form.register('password')} />
      <FormError error={accept.error} hideFields={['password']} />
      <Button type="submit" variant="primary" busy={accept.isPending}>
        Join {invitation.teamName}
      </Button>
    </form>
  );
}

function Closed({ title, body, error }: { title: string; body?: string; error?: unknown }) {
  return (
    <div className="mx-auto w-full max-w-md">
      <h1 className="mb-3 text-title">{title}</h1>
      {body && <p className="mb-4 text-body text-ink-soft">{body}</p>}
      <FormError error={error} className="mb-4" />
      <Link to="/sign-in" className="text-body font-medium text-signal-dark underline underline-offset-2">
        Go to sign in
      </Link>
    </div>
  );
}
