import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import type { Me } from '@shared/schemas/auth';
import { DisplayName } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { CheckboxField } from '@/components/ui/checkbox-field';
import { FormError } from '@/components/ui/form-error';
import { InlineStatus } from '@/components/ui/inline-status';
import { KeyValueList } from '@/components/ui/key-value-list';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingBlock } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useMe } from '@/api/me/get-me';
import { useUpdateMe } from '@/api/me/update-me';

const SettingsForm = z.object({ displayName: DisplayName, notifyByEmail: z.boolean() });

export function SettingsPage() {
  const { data: me } = useMe();
  if (!me) return <LoadingBlock />;
  return (
    <div className="max-w-2xl">
      <PageHeader title="My settings" subtitle="How your name appears to your teams, and which e-mails you get." />
      <div className="flex flex-col gap-5">
        <Card title="Profile and notifications">
          <ProfileForm me={me} />
        </Card>
        <Card title="Account">
          <KeyValueList
            items={[
              { label: 'E-mail (sign-in)', value: me.email },
              { label: 'Teams', value: me.teams.length === 0 ? 'none' : me.teams.map((t) => t.name).join(', ') },
            ]}
          />
        </Card>
      </div>
    </div>
  );
}

function ProfileForm({ me }: { me: Me }) {
  const update = useUpdateMe();
  const [saved, setSaved] = useState(false);
  const form = useForm({ resolver: zodResolver(SettingsForm), values: { displayName: me.displayName, notifyByEmail: me.notifyByEmail } });
  const { errors, isDirty } = form.formState;
  const onSubmit = form.handleSubmit((values) => {
    setSaved(false);
    update.mutate(values, { onSuccess: () => setSaved(true) });
  });
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
      <TextField label="Display name" autoComplete="name" hint="Shown beside your marks, reviews and in member lists." error={errors.displayName?.message} {...form.register('displayName')} />
      <CheckboxField
        label="E-mail me about my team's work"
        hint="Notices about work in my teams, such as fits waiting for my review. Invitations to join a team are sent either way."
        {...form.register('notifyByEmail')}
      />
      <FormError error={update.error} hideFields={['displayName', 'notifyByEmail']} />
      {saved && !isDirty && <InlineStatus tone="ok">Saved.</InlineStatus>}
      <div>
        <Button type="submit" variant="primary" busy={update.isPending} disabled={!isDirty}>
          Save changes
        </Button>
      </div>
    </form>
  );
}
