// The only module that runs ffmpeg and ffprobe. fluent-ffmpeg builds the
// commands; long runs go through spawnInGroup (own process group, killed when
// this process exits or dies) and become promises with progress callbacks, and
// every long run can be cancelled through an AbortSignal (the group is killed).
import { createInterface } from 'node:readline';
import path from 'node:path';
import ffmpeg from 'fluent-ffmpeg';
import { ffmpegBinary, ffprobeBinary } from '../config';
import { killChildGroup, spawnInGroup } from './process-groups';

export interface ProbeResult {
  formatName: string;
  codec: string;
  /** Coded size of the stored picture. */
  width: number;
  height: number;
  /** Clockwise rotation a player applies for display (0, 90, 180, 270). */
  rotationDeg: number;
  /** Rate the file plays at (avg_frame_rate, else r_frame_rate). */
  containerFps: number;
  /** Nominal base rate (r_frame_rate): the tick of a constant-rate file. */
  baseFps: number;
  /** From the container header; null when the container does not say (Matroska, WebM). */
  headerFrameCount: number | null;
  durationS: number;
}

export class MediaError extends Error {
  constructor(message: string, readonly stderr = '') {
    super(message);
  }
}

export class CancelledError extends Error {
  constructor() {
    super('cancelled');
  }
}

function rate(text: string | undefined): number {
  if (!text) return 0;
  const [n, d] = text.split('/').map(Number);
  const value = d ? n / d : n;
  return Number.isFinite(value) && value > 0 ? value : 0;
}

function normaliseDeg(deg: number): number {
  return ((Math.round(deg / 90) * 90) % 360 + 360) % 360;
}

/** Stream facts of the first video stream; throws MediaError when the file is not a readable video. */
export function probe(file: string): Promise<ProbeResult> {
  return new Promise((resolve, reject) => {
    ffmpeg.ffprobe(file, (err, data) => {
      if (err) {
        // ffprobe's last stderr line is the useful one ("moov atom not found", "Invalid data found…").
        const lines = String(err.message).split('\n').map((l) => l.trim()).filter(Boolean);
        const reason = lines.filter((l) => !/^ffprobe exited|^Cannot find ffprobe/.test(l)).pop() ?? 'unreadable';
        return reject(new MediaError(reason.replace(/^.*?: /, ''), String(err.message)));
      }
      const video = data.streams.find((s) => s.codec_type === 'video');
      if (!video) return reject(new MediaError('the file has no video stream'));
      // fluent-ffmpeg flattens the display-matrix side data into the stream object.
      const loose = video as { rotation?: number | string; side_data_list?: { rotation?: number }[] };
      const sideRotation = loose.rotation !== undefined && loose.rotation !== '' ? Number(loose.rotation) : loose.side_data_list?.find((s) => typeof s.rotation === 'number')?.rotation;
      const tagRotation = video.tags?.rotate !== undefined ? Number(video.tags.rotate) : undefined;
      // The display matrix angle is counter-clockwise (libavutil av_display_rotation_get);
      // ffmpeg's autorotate turns the picture by it. An old-style `rotate` tag is clockwise.
      const rotationDeg = normaliseDeg(sideRotation !== undefined && Number.isFinite(sideRotation) ? -sideRotation : (tagRotation ?? 0));
      const nb = Number(video.nb_frames);
      resolve({
        formatName: String(data.format.format_name ?? ''),
        codec: String(video.codec_name ?? 'unknown'),
        width: Number(video.width ?? 0),
        height: Number(video.height ?? 0),
        rotationDeg,
        containerFps: rate(video.avg_frame_rate) || rate(video.r_frame_rate),
        baseFps: rate(video.r_frame_rate) || rate(video.avg_frame_rate),
        headerFrameCount: Number.isFinite(nb) && nb > 0 ? nb : null,
        durationS: Number(video.duration) || Number(data.format.duration) || 0,
      });
    });
  });
}

function ffprobePath(): string {
  return ffprobeBinary();
}

/**
 * Presentation timestamps (s) of every video frame in presentation order, read
 * from the packets (no decoding). Packets come in decode order, so B-frames make
 * them non-monotonic; sorting restores display order, which is also the order
 * ffmpeg's decoder numbers frames in.
 */
export function frameTimestamps(file: string, signal?: AbortSignal): Promise<number[]> {
  return new Promise((resolve, reject) => {
    const child = spawnInGroup(ffprobePath(), ['-v', 'error', '-select_streams', 'v:0', '-show_entries', 'packet=pts_time,dts_time', '-of', 'csv=p=0', file], {
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    const onAbort = () => killChildGroup(child);
    signal?.addEventListener('abort', onAbort, { once: true });
    const times: number[] = [];
    let stderr = '';
    child.stderr!.on('data', (d) => (stderr += d));
    createInterface({ input: child.stdout! }).on('line', (line) => {
      const [pts, dts] = line.split(',');
      const t = Number(pts !== 'N/A' && pts !== '' ? pts : dts);
      if (Number.isFinite(t)) times.push(t);
    });
    child.on('error', (err) => reject(new MediaError(`ffprobe could not run: ${err.message}`)));
    child.on('close', (code) => {
      signal?.removeEventListener('abort', onAbort);
      if (signal?.aborted) return reject(new CancelledError());
      if (code !== 0) return reject(new MediaError(stderr.trim().split('\n').pop() || `ffprobe exited with ${code}`, stderr));
      resolve(times.sort((a, b) => a - b));
    });
  });
}

/** mjpeg's -q:v runs 2 (best) … 31 (worst); map a 1–100 quality onto it. */
export function mjpegQScale(jpegQuality: number): number {
  const q = Math.round(31 - (Math.min(100, Math.max(1, jpegQuality)) / 100) * 29);
  return Math.min(31, Math.max(2, q));
}

export interface ExtractFramesOptions {
  input: string;
  outDir: string;
  /** First and last source frame number (0-based, inclusive). */
  inFrame: number;
  outFrame: number;
  jpegQuality: number;
  /** Also write a thumbnail strip (`thumb-00.jpg`, …) of these source frames, in the same decoding pass. */
  thumbnails?: { outDir: string; frameNumbers: number[]; widthPx: number; jpegQuality: number };
  /** Called with the number of frames written so far. */
  onProgress?: (framesDone: number) => void;
  signal?: AbortSignal;
}

/**
 * The ffmpeg command of an extraction: only frames IN..OUT pass the select
 * filter; passthrough timing writes each decoded frame once (no duplicates to
 * fill a constant rate, none dropped); files are numbered by source frame.
 * ffmpeg's default autorotate turns the picture upright before the filters.
 * The thumbnail strip branches off the same decoded frames (split), so the
 * clip is decoded once; both outputs stop at OUT (-frames:v), not at the end of the file.
 */
function extractCommand(o: Omit<ExtractFramesOptions, 'onProgress' | 'signal'>) {
  const count = o.outFrame - o.inFrame + 1;
  const range = `select='between(n\\,${o.inFrame}\\,${o.outFrame})'`;
  const command = ffmpeg(o.input).inputOptions(['-hide_banner', '-nostdin']);
  const frameOptions = [
    '-fps_mode', 'passthrough',
    '-frames:v', String(count),
    '-start_number', String(o.inFrame),
    '-q:v', String(mjpegQScale(o.jpegQuality)),
    '-f', 'image2',
  ];
  const thumbs = o.thumbnails?.frameNumbers.filter((n) => n >= o.inFrame && n <= o.outFrame) ?? [];
  if (!o.thumbnails || thumbs.length === 0) {
    return command.outputOptions(['-map', '0:v:0', '-vf', range, ...frameOptions]).output(path.join(o.outDir, '%06d.jpg'));
  }
  // After the range select, n counts from IN, so the strip picks frames relative to it.
  const pick = thumbs.map((n) => `eq(n\\,${n - o.inFrame})`).join('+');
  return command
    .complexFilter(`[0:v:0]${range},split=2[frames][strip];[strip]select='${pick}',scale=${o.thumbnails.widthPx}:-2[thumbs]`)
    .output(path.join(o.outDir, '%06d.jpg'))
    .outputOptions(['-map', '[frames]', ...frameOptions])
    .output(path.join(o.thumbnails.outDir, 'thumb-%02d.jpg'))
    .outputOptions([
      '-map', '[thumbs]',
      '-fps_mode', 'passthrough',
      '-frames:v', String(thumbs.length),
      '-start_number', '0',
      '-q:v', String(mjpegQScale(o.thumbnails.jpegQuality)),
      '-f', 'image2',
    ]);
}

/** The exact ffmpeg argument list extractFrames runs (the bench runs it directly as a baseline). */
export function extractFramesArgs(o: Omit<ExtractFramesOptions, 'onProgress' | 'signal'>): string[] {
  return (extractCommand(o) as unknown as { _getArguments: () => string[] })._getArguments();
}

/** Frame file name for a source frame number, as extractFrames writes it. */
export function frameFileName(frameNumber: number): string {
  return `${String(frameNumber).padStart(6, '0')}.jpg`;
}

const FRAME_COUNTER = /frame=\s*(\d+)/;

function ffmpegPath(): string {
  return ffmpegBinary();
}

/**
 * Runs a fluent-ffmpeg command (its argument list) in a process group of its
 * own, as a promise. Progress is read from ffmpeg's own status lines (frame=N)
 * rather than fluent-ffmpeg's 'progress' event, which would start an extra
 * ffprobe of the input to compute a percentage.
 */
function runCommand(command: ffmpeg.FfmpegCommand, onFrames: ((n: number) => void) | undefined, signal?: AbortSignal): Promise<void> {
  return new Promise((resolve, reject) => {
    if (signal?.aborted) return reject(new CancelledError());
    const args = (command as unknown as { _getArguments: () => string[] })._getArguments();
    const child = spawnInGroup(ffmpegPath(), args, { stdio: ['ignore', 'ignore', 'pipe'] });
    const onAbort = () => killChildGroup(child);
    signal?.addEventListener('abort', onAbort, { once: true });
    // Keep the tail of stderr for the error message; status lines end in \r.
    let tail = '';
    let partial = '';
    child.stderr!.setEncoding('utf8');
    child.stderr!.on('data', (chunk: string) => {
      tail = (tail + chunk).slice(-8192);
      if (!onFrames) return;
      const parts = (partial + chunk).split(/[\r\n]/);
      partial = parts.pop() ?? '';
      for (const line of parts) {
        const m = FRAME_COUNTER.exec(line);
        if (m) onFrames(Number(m[1]));
      }
    });
    child.on('error', (err) => {
      signal?.removeEventListener('abort', onAbort);
      reject(new MediaError(`ffmpeg could not run: ${err.message}`));
    });
    child.on('close', (code, sig) => {
      signal?.removeEventListener('abort', onAbort);
      if (signal?.aborted) return reject(new CancelledError());
      if (code === 0) return resolve();
      const last = tail.trim().split(/[\r\n]+/).filter(Boolean).pop();
      reject(new MediaError(last ? `ffmpeg failed: ${last}` : `ffmpeg exited with ${sig ?? code}`, tail));
    });
  });
}

/** Extracts frames IN..OUT to `outDir/NNNNNN.jpg` named by source frame number. */
export async function extractFrames(o: ExtractFramesOptions): Promise<void> {
  await runCommand(extractCommand(o), o.onProgress, o.signal);
}

export interface ThumbnailStripOptions {
  input: string;
  outDir: string;
  /** Source frame numbers to show, ascending. */
  frameNumbers: number[];
  widthPx: number;
  jpegQuality: number;
  signal?: AbortSignal;
}

/** Small upright JPEGs `thumb-00.jpg`, `thumb-01.jpg`, … of the chosen frames, for scrubbing. */
export async function thumbnailStrip(o: ThumbnailStripOptions): Promise<number> {
  if (o.frameNumbers.length === 0) return 0;
  const pick = o.frameNumbers.map((n) => `eq(n\\,${n})`).join('+');
  const command = ffmpeg(o.input)
    .inputOptions(['-hide_banner', '-nostdin'])
    .outputOptions([
      '-map', '0:v:0',
      '-vf', `select='${pick}',scale=${o.widthPx}:-2`,
      '-fps_mode', 'passthrough',
      '-frames:v', String(o.frameNumbers.length),
      '-start_number', '0',
      '-q:v', String(mjpegQScale(o.jpegQuality)),
      '-f', 'image2',
    ])
    .output(path.join(o.outDir, 'thumb-%02d.jpg'));
  await runCommand(command, undefined, o.signal);
  return o.frameNumbers.length;
}

export interface EncodeRawOptions {
  outFile: string;
  width: number;
  height: number;
  pixFmt: 'gray' | 'rgb24';
  /** Rate written into the container. */
  fps: number;
  /** Extra output arguments (codec, rate control, timestamps filter, metadata). */
  outputArgs: string[];
  signal?: AbortSignal;
}

export interface RawEncoder {
  /** Write one frame; resolves when the pipe can take more (back-pressure). */
  write(frame: Buffer): Promise<void>;
  /** Close the input and wait for ffmpeg to finish the file. */
  finish(): Promise<void>;
}

/** Starts ffmpeg reading raw frames on stdin (the synthetic clip generator renders in Node). */
export function encodeRawFrames(o: EncodeRawOptions): RawEncoder {
  const child = spawnInGroup(
    ffmpegPath(),
    [
      '-hide_banner', '-nostdin', '-loglevel', 'error', '-y',
      '-f', 'rawvideo', '-pix_fmt', o.pixFmt, '-s', `${o.width}x${o.height}`, '-r', String(o.fps), '-i', 'pipe:0',
      ...o.outputArgs,
      o.outFile,
    ],
    { stdio: ['pipe', 'ignore', 'pipe'] },
  );
  let stderr = '';
  child.stderr!.on('data', (d) => (stderr += d));
  const done = new Promise<void>((resolve, reject) => {
    child.on('error', (err) => reject(new MediaError(`ffmpeg could not run: ${err.message}`)));
    child.on('close', (code) => (code === 0 ? resolve() : reject(new MediaError(`ffmpeg encode failed (${code}): ${stderr.trim()}`, stderr))));
  });
  done.catch(() => {});
  o.signal?.addEventListener('abort', () => killChildGroup(child), { once: true });
  const stdin = child.stdin!;
  stdin.on('error', () => {}); // a failed encode surfaces through `done`
  return {
    write: (frame) =>
      new Promise((resolve, reject) => {
        if (child.exitCode !== null) return done.then(() => reject(new MediaError('ffmpeg exited early')), reject);
        if (stdin.write(frame)) resolve();
        else stdin.once('drain', () => resolve());
      }),
    finish: async () => {
      stdin.end();
      await done;
    },
  };
}

/** Copies the streams into a new file with extra output arguments (e.g. rotation metadata). */
export function remux(input: string, output: string, extraArgs: string[]): Promise<void> {
  return runCommand(ffmpeg(input).outputOptions(['-map', '0', '-c', 'copy', ...extraArgs]).output(output), undefined);
}
