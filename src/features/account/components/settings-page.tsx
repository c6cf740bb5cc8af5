import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import type { Me } from '@shared/schemas/auth';
import { DisplayName } from '@shared/schemas/auth';
import { NOTIFICATION_MODES, NOTIFICATION_MODE_LABELS, NotificationMode } from '@shared/schemas/notifications';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { InlineStatus } from '@/components/ui/inline-status';
import { KeyValueList } from '@/components/ui/key-value-list';
import { PageHeader } from '@/components/ui/page-header';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { LoadingBlock } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useMe } from '@/api/me/get-me';
import { useUpdateMe } from '@/api/me/update-me';

const SettingsForm = z.object({ displayName: DisplayName, notificationMode: NotificationMode });
const MODE_OPTIONS = NOTIFICATION_MODES.map((value) => ({ value, label: NOTIFICATION_MODE_LABELS[value] }));

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
  const form = useForm({ resolver: zodResolver(SettingsForm), values: { displayName: me.displayName, notificationMode: me.notificationMode } });
  const { errors, isDirty } = form.formState;
  const onSubmit = form.handleSubmit((values) => {
    setSaved(false);
    update.mutate(values, { onSuccess: () => setSaved(true) });
  });
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
      <TextField label="Display name" autoComplete="name" hint="Shown beside your marks, reviews and in member lists." error={errors.displayName?.message} {...form.register('displayName')} />
      <div className="flex flex-col gap-1">
        <SegmentedControl
          label="E-mail when work reaches me"
          showLabel
          options={MODE_OPTIONS}
          value={form.watch('notificationMode')}
          onChange={(mode) => form.setValue('notificationMode', mode, { shouldDirty: true })}
        />
        <p className="text-micro text-ink-soft">
          Hand-offs in my teams: a clip ready to mark, a track ready for a fit, a fit waiting for my review or sent back with a note. The daily digest lists them in one
          message. Invitations to join a team are sent either way.
        </p>
      </div>
      <FormError error={update.error} hideFields={['displayName', 'notificationMode']} />
      {saved && !isDirty && <InlineStatus tone="ok">Saved.</InlineStatus>}
      <div>
        <Button type="submit" variant="primary" busy={update.isPending} disabled={!isDirty}>
          Save changes
        </Button>
      </div>
    </form>
  );
}
