// Receiving a clip upload: multer streams the file part to a temp file (never
// into memory) while hashing it; then the bytes are sniffed and ffprobe says
// whether it is a video we can work with. Every rejection is a problem+json
// reason, and the temp file is removed however the request ends.
import { createHash, randomBytes } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { mkdir, rm } from 'node:fs/promises';
import path from 'node:path';
import { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Request, RequestHandler } from 'express';
import { fileTypeFromFile } from 'file-type';
import multer, { MulterError, type StorageEngine } from 'multer';
import { HttpProblem, badRequest } from '../http/problem';
import { MediaError, frameTimestamps, probe, type ProbeResult } from '../media/ffmpeg';

/** What the storage engine adds to `req.file`. */
export interface ReceivedFile extends Express.Multer.File {
  sha256: string;
}

/** A multer storage engine writing to `dir` and computing SHA-256 on the way through. */
export function hashingDiskStorage(dir: string): StorageEngine {
  return {
    _handleFile(req, file, cb) {
      const target = path.join(dir, `upload-${Date.now().toString(36)}-${randomBytes(6).toString('hex')}`);
      const hash = createHash('sha256');
      let size = 0;
      const tap = new Transform({
        transform(chunk: Buffer, _enc, done) {
          hash.update(chunk);
          size += chunk.length;
          done(null, chunk);
        },
      });
      // A client that goes away mid-stream: the pipeline fails and the partial file goes.
      const onAbort = () => tap.destroy(new Error('the upload was interrupted'));
      req.once('close', () => {
        if (!req.complete) onAbort();
      });
      mkdir(dir, { recursive: true })
        .then(() => pipeline(file.stream, tap, createWriteStream(target)))
        .then(() => cb(null, { path: target, size, sha256: hash.digest('hex') } as Partial<ReceivedFile>))
        .catch(async (err: Error) => {
          await rm(target, { force: true });
          cb(err);
        });
    },
    _removeFile(_req, file, cb) {
      if (!file.path) return cb(null);
      rm(file.path, { force: true }).then(() => cb(null), cb);
    },
  };
}

function formatBytes(bytes: number): string {
  const units: [number, string][] = [[1024 ** 3, 'GiB'], [1024 ** 2, 'MiB'], [1024, 'KiB']];
  for (const [size, unit] of units) {
    if (bytes >= size) return `${Number((bytes / size).toFixed(1))} ${unit}`;
  }
  return `${bytes} bytes`;
}

export function tooLarge(limitBytes: number): HttpProblem {
  return new HttpProblem(413, 'File too large', `The clip is larger than the upload limit of ${formatBytes(limitBytes)}. Trim it to the shot before uploading.`);
}

/**
 * Middleware receiving the multipart `file` part (and text fields) into a temp
 * file under `tempDir`. Removes the temp file when the response ends, so a
 * handler only has to move the file away to keep it.
 */
export function receiveClipUpload(tempDir: string, limitBytes: number): RequestHandler {
  const upload = multer({
    storage: hashingDiskStorage(tempDir),
    limits: { fileSize: limitBytes, files: 1, fields: 10, fieldSize: 1000, parts: 12 },
  }).single('file');
  return (req, res, next) => {
    if (!req.is('multipart/form-data')) return next(badRequest('Send the clip as multipart/form-data with the file in the field `file`.'));
    // Refuse early when the declared size is already over the limit (no point streaming it).
    const declared = Number(req.get('content-length'));
    if (Number.isFinite(declared) && declared > limitBytes + 64 * 1024) {
      res.set('Connection', 'close');
      return next(tooLarge(limitBytes));
    }
    res.on('close', () => {
      const file = req.file as ReceivedFile | undefined;
      if (file?.path) void rm(file.path, { force: true });
    });
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(tooLarge(limitBytes));
        if (err.code === 'LIMIT_UNEXPECTED_FILE') return next(badRequest(`Unexpected file field "${err.field}": send one clip in the field \`file\`.`));
        return next(badRequest(`The upload form is not as expected: ${err.message}.`));
      }
      const message = (err as Error)?.message ?? String(err);
      if (/interrupted|Unexpected end of form|aborted/i.test(message)) return next(badRequest('The upload was interrupted before the file was complete. Try again.'));
      if (/Malformed part header|Multipart: Boundary not found/i.test(message)) return next(badRequest('The upload is not valid multipart/form-data.'));
      next(err);
    });
  };
}

export function receivedFile(req: Request): ReceivedFile | undefined {
  return req.file as ReceivedFile | undefined;
}

// ---------------------------------------------------------------- inspection

/** Containers we accept, by what their first bytes say (file-type), not by name. */
const VIDEO_CONTAINERS = new Set(['mp4', 'm4v', 'mov', 'mkv', 'webm', 'avi']);
export const MIN_DIMENSION_PX = 16;
export const MAX_DIMENSION_PX = 8192;

export interface InspectedClip {
  container: string;
  probe: ProbeResult;
  ptsS: number[];
  frameCount: number;
}

const unsupported = (detail: string) => new HttpProblem(415, 'Not a supported video', detail);
const unreadable = (detail: string) => new HttpProblem(422, 'Unreadable video', detail);

export async function inspectClip(file: string, sizeBytes: number, originalName: string): Promise<InspectedClip> {
  if (sizeBytes === 0) throw badRequest(`${originalName} is empty (0 bytes).`);
  const type = await fileTypeFromFile(file);
  if (!type) throw unsupported(`${originalName} is not a video file: its contents match no known format. Upload an MP4, MOV, MKV, WebM or AVI clip.`);
  if (!VIDEO_CONTAINERS.has(type.ext)) {
    throw unsupported(`${originalName} is ${type.mime} (.${type.ext}), not a video. Upload an MP4, MOV, MKV, WebM or AVI clip.`);
  }
  let facts: ProbeResult;
  try {
    facts = await probe(file);
  } catch (err) {
    if (err instanceof MediaError) throw unreadable(`${originalName} looks like ${type.ext.toUpperCase()} but cannot be read as video (${err.message}). The file may be truncated or damaged.`);
    throw err;
  }
  if (facts.codec === 'unknown' || facts.codec === 'none') throw unsupported(`${originalName} uses a video codec this server cannot decode.`);
  const { width, height } = facts;
  if (width < MIN_DIMENSION_PX || height < MIN_DIMENSION_PX || width > MAX_DIMENSION_PX || height > MAX_DIMENSION_PX) {
    throw unreadable(`${originalName} is ${width}×${height} pixels; clips must be between ${MIN_DIMENSION_PX} and ${MAX_DIMENSION_PX} pixels on each side.`);
  }
  let ptsS: number[];
  try {
    ptsS = await frameTimestamps(file);
  } catch (err) {
    if (err instanceof MediaError) throw unreadable(`${originalName}: the frames cannot be read (${err.message}).`);
    throw err;
  }
  if (ptsS.length === 0) throw unreadable(`${originalName} contains no video frames.`);
  if (facts.headerFrameCount !== null && ptsS.length < facts.headerFrameCount) {
    throw unreadable(`${originalName} is truncated: its header lists ${facts.headerFrameCount} frames but only ${ptsS.length} are in the file.`);
  }
  if (!(facts.containerFps > 0)) throw unreadable(`${originalName} states no frame rate.`);
  return { container: type.ext, probe: facts, ptsS, frameCount: ptsS.length };
}
