import { useState } from 'react';
import { useNavigate } from 'react-router';
import { HANDBOOK_DRAG } from '@shared/physics/handbook-drag';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormError } from '@/components/ui/form-error';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useCreatePreset } from '@/api/presets/create-preset';
import { useLaunchers } from '@/api/launchers/list-launchers';
import { useProjectiles } from '@/api/projectiles/list-projectiles';

/** Version 1 of a preset: a handbook drag value with its source, and an efficiency stated as an assumption. */
export function CreatePresetDialog({ teamId, onClose }: { teamId: string; onClose: () => void }) {
  const launchers = useLaunchers(teamId);
  const projectiles = useProjectiles(teamId);
  const create = useCreatePreset(teamId);
  const navigate = useNavigate();
  const [form, setForm] = useState({ name: '', launcherId: '', projectileId: '', minKPa: '200', maxKPa: '600', handbookBody: 'smooth sphere, subcritical', efficiencyPct: '50', efficiencyStdPct: '15', efficiencyNote: '' });
  const set = (k: keyof typeof form) => (e: { target: { value: string } }) => setForm((f) => ({ ...f, [k]: e.target.value }));
  const submit = () =>
    create.mutate(
      {
        name: form.name,
        launcherId: form.launcherId,
        projectileId: form.projectileId,
        pressureMinPa: Number(form.minKPa) * 1000,
        pressureMaxPa: Number(form.maxKPa) * 1000,
        handbookBody: form.handbookBody,
        efficiency: Number(form.efficiencyPct) / 100,
        efficiencyStd: Number(form.efficiencyStdPct) / 100,
        efficiencyNote: form.efficiencyNote,
      },
      { onSuccess: (p) => navigate(`/t/${teamId}/presets/${p.id}`) },
    );
  return (
    <Dialog
      open
      onClose={onClose}
      title="New preset"
      description="Version 1 starts from a handbook drag coefficient (its source is kept) and an efficiency you state as an assumption."
      footer={
        <>
          <Button onClick={onClose}>Cancel</Button>
          <Button variant="primary" busy={create.isPending} onClick={submit}>Create preset</Button>
        </>
      }
    >
      <div className="flex flex-col gap-3">
        <TextField label="Name" value={form.name} onChange={set('name')} required />
        <SelectField label="Launcher" placeholder="Choose…" value={form.launcherId} onChange={set('launcherId')} options={(launchers.data ?? []).map((l) => ({ value: l.id, label: l.name }))} required />
        <SelectField label="Projectile" placeholder="Choose…" value={form.projectileId} onChange={set('projectileId')} options={(projectiles.data ?? []).map((p) => ({ value: p.id, label: p.name }))} required />
        <div className="grid grid-cols-2 gap-3">
          <TextField label="Lowest pressure" type="number" suffix="kPa" value={form.minKPa} onChange={set('minKPa')} />
          <TextField label="Highest pressure" type="number" suffix="kPa" value={form.maxKPa} onChange={set('maxKPa')} />
        </div>
        <SelectField label="Starting drag coefficient" value={form.handbookBody} onChange={set('handbookBody')} options={HANDBOOK_DRAG.map((h) => ({ value: h.body, label: `${h.body}: ${h.dragCoefficient} (${h.source})` }))} />
        <div className="grid grid-cols-2 gap-3">
          <TextField label="Assumed efficiency" type="number" suffix="%" value={form.efficiencyPct} onChange={set('efficiencyPct')} />
          <TextField label="Its uncertainty (1σ)" type="number" suffix="%" value={form.efficiencyStdPct} onChange={set('efficiencyStdPct')} />
        </div>
        <TextField label="Why this efficiency" value={form.efficiencyNote} onChange={set('efficiencyNote')} hint="Stated with the assumption, e.g. “typical of a diaphragm valve, from memory”." />
        <FormError error={create.error ?? launchers.error ?? projectiles.error} />
      </div>
    </Dialog>
  );
}
