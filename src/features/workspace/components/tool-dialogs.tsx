import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { TextField } from '@/components/ui/text-field';
import type { Editor } from '../editor/editor-store';
import { useEditor } from '../hooks/use-editor';

/** The small forms tools ask for: the scale length, the stated roll, the rectangle size. */
export function ToolDialogs({ editor }: { editor: Editor }) {
  const dialog = useEditor(editor, (s) => s.dialog);
  const cancel = () => editor.toolEvent({ type: 'cancel' });
  if (dialog === 'scale-length') return <ScaleLengthDialog editor={editor} onCancel={cancel} />;
  if (dialog === 'level-angle') return <LevelAngleDialog editor={editor} onCancel={cancel} />;
  if (dialog === 'plane-size') return <PlaneSizeDialog editor={editor} onCancel={cancel} />;
  return null;
}

const parse = (text: string) => Number(text.trim().replace(',', '.'));

function ScaleLengthDialog({ editor, onCancel }: { editor: Editor; onCancel: () => void }) {
  const [length, setLength] = useState('');
  const [tolerance, setTolerance] = useState('1');
  const [error, setError] = useState<string | null>(null);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const lengthM = parse(length);
    const toleranceM = parse(tolerance) / 1000;
    if (!(lengthM > 0)) return setError('Enter the reference length in metres, more than 0.');
    if (!(toleranceM >= 0) || toleranceM >= lengthM) return setError('The tolerance must be 0 or more and smaller than the length.');
    editor.toolEvent({ type: 'submit', values: { lengthM, toleranceM } });
  };
  return (
    <Dialog
      open
      onClose={onCancel}
      title="Length of the scale reference"
      description="How long is the object between the two ends you clicked, and how well is that length known?"
      size="sm"
    >
      <form onSubmit={submit} className="flex flex-col gap-3">
        <TextField label="Length" suffix="m" inputMode="decimal" autoFocus required value={length} onChange={(e) => setLength(e.target.value)} error={error ?? undefined} />
        <TextField label="Tolerance (±)" suffix="mm" inputMode="decimal" value={tolerance} onChange={(e) => setTolerance(e.target.value)} hint="As stated for the reference, e.g. ±1 mm for a steel rule." />
        <div className="flex justify-end gap-2">
          <Button onClick={onCancel}>Cancel</Button>
          <Button type="submit" variant="primary">Use this length</Button>
        </div>
      </form>
    </Dialog>
  );
}

function LevelAngleDialog({ editor, onCancel }: { editor: Editor; onCancel: () => void }) {
  const [angle, setAngle] = useState('0');
  const [error, setError] = useState<string | null>(null);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const angleDeg = parse(angle);
    if (!Number.isFinite(angleDeg) || Math.abs(angleDeg) >= 45) return setError('Enter a roll between −45° and 45°.');
    editor.toolEvent({ type: 'submit', values: { angleDeg } });
  };
  return (
    <Dialog open onClose={onCancel} title="Camera roll" description="The angle a level line makes on screen, counter-clockwise positive." size="sm">
      <form onSubmit={submit} className="flex flex-col gap-3">
        <TextField label="Roll" suffix="°" inputMode="decimal" autoFocus value={angle} onChange={(e) => setAngle(e.target.value)} error={error ?? undefined} />
        <div className="flex justify-end gap-2">
          <Button onClick={onCancel}>Cancel</Button>
          <Button type="submit" variant="primary">Set roll</Button>
        </div>
      </form>
    </Dialog>
  );
}

function PlaneSizeDialog({ editor, onCancel }: { editor: Editor; onCancel: () => void }) {
  const [width, setWidth] = useState('');
  const [height, setHeight] = useState('');
  const [error, setError] = useState<string | null>(null);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const widthM = parse(width);
    const heightM = parse(height);
    if (!(widthM > 0) || !(heightM > 0)) return setError('Enter the rectangle’s width and height in metres, both more than 0.');
    editor.toolEvent({ type: 'submit', values: { widthM, heightM } });
  };
  return (
    <Dialog open onClose={onCancel} title="Size of the rectangle" description="Width along the top edge and height along the side, as measured on the rectangle." size="sm">
      <form onSubmit={submit} className="flex flex-col gap-3">
        <TextField label="Width" suffix="m" inputMode="decimal" autoFocus value={width} onChange={(e) => setWidth(e.target.value)} error={error ?? undefined} />
        <TextField label="Height" suffix="m" inputMode="decimal" value={height} onChange={(e) => setHeight(e.target.value)} />
        <div className="flex justify-end gap-2">
          <Button onClick={onCancel}>Cancel</Button>
          <Button type="submit" variant="primary">Set plane fix</Button>
        </div>
      </form>
    </Dialog>
  );
}
