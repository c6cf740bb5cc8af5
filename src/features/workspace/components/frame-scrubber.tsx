import { frameTimeS } from '@shared/marking/frame-time';
import { formatNumber } from '@/lib/format';
import type { Editor } from '../editor/editor-store';
import { useEditor } from '../hooks/use-editor';

/** Slider over the clip's frames, with buttons for the same steps as the keys, and the frame number and time always in view. */
export function FrameScrubber({ editor, captureFps }: { editor: Editor; captureFps: number }) {
  const frames = useEditor(editor, (s) => s.frames);
  const frameNumber = useEditor(editor, (s) => s.frameNumber);
  const index = Math.max(0, frames.findIndex((f) => f.frameNumber === frameNumber));
  const tS = frameTimeS(frameNumber, frames[index]?.tS, captureFps) ?? 0;
  const last = frames.length - 1;
  const step = (by: number) => () => editor.step(by);
  const btn = 'h-8 min-w-8 rounded-md border border-line bg-paper-raised px-2 text-body text-ink-soft hover:bg-paper-sunk disabled:opacity-40';
  return (
    <div className="flex flex-wrap items-center gap-3 rounded-card border border-line bg-paper-raised px-3 py-2">
      <div className="flex gap-1">
        <button type="button" className={btn} onClick={step(-10)} disabled={index === 0} aria-label="Back ten frames">«</button>
        <button type="button" className={btn} onClick={step(-1)} disabled={index === 0} aria-label="Previous frame">‹</button>
        <button type="button" className={btn} onClick={step(1)} disabled={index >= last} aria-label="Next frame">›</button>
        <button type="button" className={btn} onClick={step(10)} disabled={index >= last} aria-label="On ten frames">»</button>
      </div>
      <input
        type="range"
        min={0}
        max={Math.max(0, last)}
        value={index}
        onChange={(e) => {
          const f = frames[Number(e.target.value)];
          if (f) editor.goToFrame(f.frameNumber);
        }}
        aria-label="Frame"
        aria-valuetext={`Frame ${frameNumber}, ${formatNumber(tS * 1000, { decimals: 2 })} milliseconds`}
        className="min-w-40 flex-1 accent-[#d9822b]"
      />
      <p className="text-body tabular-nums text-ink" aria-live="off" data-testid="frame-readout">
        Frame <strong className="font-semibold">{frameNumber}</strong>
        <span className="text-ink-faint"> / {frames[last]?.frameNumber ?? 0}</span>
        <span className="mx-2 text-ink-faint">·</span>
        t = <strong className="font-semibold">{formatNumber(tS * 1000, { decimals: 2 })}</strong> ms
        <span className="ml-2 text-micro text-ink-faint">at {formatNumber(captureFps, { digits: 5 })} fps</span>
      </p>
    </div>
  );
}
