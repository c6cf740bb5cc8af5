import { useDeferredValue, useMemo, useRef, useState } from 'react';
import { Badge } from '@/components/ui/badge';
import { buttonClasses, Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { DataTable, dataTableColumns } from '@/components/ui/data-table';
import { formatNumber } from '@/lib/format';
import type { CalibrationTransform } from '@shared/geometry/calibration-transform';
import type { MarksCsvKind } from '@shared/schemas/marking';
import { exportMarksUrl } from '@/api/marks/export-marks';
import { fetchMarks } from '@/api/marks/list-marks';
import { useImportMarks } from '@/api/marks/import-marks';
import type { Editor } from '../editor/editor-store';
import { needsReview } from '../editor/review-pass';
import { useEditor } from '../hooks/use-editor';
import { apiMarkToEditor, type MarkSaving } from '../hooks/use-mark-saving';
import { useWorldMarks, type WorldMark } from '../hooks/use-world-marks';

/** A ledger row: the mark's time and place, and where it came from (the automatic marker and how sure it was). */
interface LedgerRow extends WorldMark {
  source: 'auto' | 'person';
  confidence: number | null;
  flagged: boolean;
  reason: string | null;
  offCurve: boolean;
}

const col = dataTableColumns<LedgerRow>();

interface MarksLedgerProps {
  editor: Editor;
  teamId: string;
  transform: CalibrationTransform | null;
  saving: MarkSaving;
  /** The team's review threshold: automatic marks below it say "check". */
  threshold: number;
  /** Frames whose mark sits off the live preview curve. */
  offCurve: Set<number>;
}

/** Every mark of the active track with its time, pixel and world position; CSV in and out. */
export function MarksLedger({ editor, teamId, transform, saving, threshold, offCurve }: MarksLedgerProps) {
  const { trackId: activeTrackId, marks: rows } = useWorldMarks(editor, teamId, transform);
  const canMark = useEditor(editor, (s) => s.permissions.canMark);
  const track = useEditor(editor, (s) => s.tracks.find((t) => t.id === activeTrackId));
  // Where each mark came from (the automatic marker and how sure it was), by frame.
  const provenance = useEditor(editor, (s) => (activeTrackId ? s.marksByTrack[activeTrackId] : undefined));

  // Everything a row shows is in the row, so the columns never change: a click then
  // updates one row instead of remounting every cell of the table.
  const ledgerRows = useMemo(
    () =>
      rows.map((r): LedgerRow => {
        const m = provenance?.[r.frameNumber];
        return {
          ...r,
          source: m?.source === 'auto' ? 'auto' : 'person',
          confidence: m?.source === 'auto' ? (m.confidence ?? null) : null,
          flagged: !!m && needsReview(m, threshold),
          reason: m?.lowConfidenceReason ?? null,
          offCurve: offCurve.has(r.frameNumber),
        };
      }),
    [rows, provenance, threshold, offCurve],
  );
  // The table follows a click at low priority, after the stage has drawn the next frame.
  const shownRows = useDeferredValue(ledgerRows);

  const columns = useMemo(
    () =>
      col.columns([
        col.accessor('frameNumber', {
          header: 'Frame',
          meta: { numeric: true },
          cell: (c) => (
            <button type="button" className="rounded-sm font-medium text-ink underline decoration-line underline-offset-2 hover:decoration-signal" onClick={() => editor.goToFrame(c.getValue())}>
              {c.getValue()}
            </button>
          ),
        }),
        col.accessor('tS', { header: 't (ms)', meta: { numeric: true }, cell: (c) => formatNumber(c.getValue() === null ? null : c.getValue()! * 1000, { decimals: 3 }) }),
        col.accessor('uPx', { header: 'u (px)', meta: { numeric: true }, cell: (c) => formatNumber(c.getValue(), { decimals: 2 }) }),
        col.accessor('vPx', { header: 'v (px)', meta: { numeric: true }, cell: (c) => formatNumber(c.getValue(), { decimals: 2 }) }),
        col.accessor('xM', { header: 'x (m)', meta: { numeric: true }, cell: (c) => formatNumber(c.getValue(), { decimals: 4 }) }),
        col.accessor('yM', { header: 'y (m)', meta: { numeric: true }, cell: (c) => formatNumber(c.getValue(), { decimals: 4 }) }),
        col.accessor('snapped', {
          header: 'How',
          cell: (c) =>
            c.row.original.source === 'auto' ? (
              <Badge tone="neutral">auto</Badge>
            ) : c.getValue() ? (
              <Badge tone="fit">snapped</Badge>
            ) : (
              <Badge tone="signal">placed</Badge>
            ),
        }),
        col.display({
          id: 'check',
          header: 'Confidence',
          cell: (c) => {
            const r = c.row.original;
            return (
              <span className="flex flex-wrap items-center gap-1">
                {r.confidence !== null && <span className="tabular-nums">{Math.round(r.confidence * 100)}%</span>}
                {r.flagged && <Badge tone="signal" title={r.reason ?? undefined}>{r.reason ? `check: ${r.reason}` : 'check'}</Badge>}
                {r.offCurve && <Badge tone="alert">off curve</Badge>}
              </span>
            );
          },
        }),
      ]),
    [editor],
  );

  return (
    <Card
      title="Marks ledger"
      subtitle={`${track?.label ?? 'No track'} · ${rows.length} marks${transform ? '' : ' · world values need a scale and an origin'}`}
      flush
    >
      <div className="p-3">
        <DataTable
          caption="Marks ledger"
          columns={columns}
          data={shownRows}
          getRowId={(r) => String(r.frameNumber)}
          dense
          filterPlaceholder={false}
          empty="No marks on this track yet. Pick Place (P) and click the projectile."
          toolbar={activeTrackId ? <CsvControls teamId={teamId} trackId={activeTrackId} canImport={canMark} hasWorld={!!transform} editor={editor} saving={saving} /> : null}
        />
      </div>
    </Card>
  );
}

interface CsvControlsProps {
  teamId: string;
  trackId: string;
  canImport: boolean;
  hasWorld: boolean;
  editor: Editor;
  saving: MarkSaving;
}

function CsvControls({ teamId, trackId, canImport, hasWorld, editor, saving }: CsvControlsProps) {
  const importMarks = useImportMarks(teamId);
  const file = useRef<HTMLInputElement>(null);
  const [kind, setKind] = useState<MarksCsvKind>('pixel');
  const [message, setMessage] = useState<{ tone: 'ok' | 'alert'; text: string } | null>(null);

  const onFile = async (f: File | undefined) => {
    if (!f) return;
    setMessage(null);
    try {
      const csv = await f.text();
      const result = await importMarks.mutateAsync({ trackId, body: { csv, kind } });
      const now = await fetchMarks(teamId, trackId);
      saving.seed(trackId, now.marks);
      editor.replaceTrackMarks(trackId, now.marks.map((m) => apiMarkToEditor(trackId, m)));
      setMessage({ tone: 'ok', text: `Imported ${result.imported} marks.` });
    } catch (err) {
      setMessage({ tone: 'alert', text: `Nothing imported: ${err instanceof Error ? err.message : String(err)}` });
    } finally {
      if (file.current) file.current.value = '';
    }
  };

  return (
    <div className="flex flex-wrap items-center gap-2">
      <a className={buttonClasses('secondary', 'sm')} href={exportMarksUrl(teamId, trackId, 'pixel')} download>
        Export pixels CSV
      </a>
      {hasWorld && (
        <a className={buttonClasses('secondary', 'sm')} href={exportMarksUrl(teamId, trackId, 'world')} download>
          Export world CSV
        </a>
      )}
      {canImport && (
        <>
          <label className="sr-only" htmlFor="ledger-import-kind">Import file type</label>
          <select
            id="ledger-import-kind"
            value={kind}
            onChange={(e) => setKind(e.target.value as MarksCsvKind)}
            className="h-7 rounded-md border border-line bg-paper-raised px-1.5 text-micro"
          >
            <option value="pixel">frame,u_px,v_px</option>
            <option value="world" disabled={!hasWorld}>t_s,x_m,y_m</option>
          </select>
          <input ref={file} type="file" accept=".csv,text/csv" className="sr-only" id="ledger-import-file" onChange={(e) => onFile(e.target.files?.[0])} />
          <Button size="sm" onClick={() => file.current?.click()} busy={importMarks.isPending}>
            Import CSV…
          </Button>
        </>
      )}
      {message && (
        <span role={message.tone === 'alert' ? 'alert' : 'status'} className={message.tone === 'alert' ? 'text-micro text-alert' : 'text-micro text-fit-dark'}>
          {message.text}
        </span>
      )}
    </div>
  );
}
