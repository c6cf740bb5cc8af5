// Receiving a clip upload: multer hands the file part to a storage engine
// that streams it straight into the clip store (a multipart upload on an
// object store, a file on local disk) while hashing it and keeping its first
// bytes for sniffing. No temp file: the only buffer is the store's own (a few
// parts in memory). ffprobe then reads the stored object in place: the file on
// local disk, a presigned URL with range requests on an object store. Every
// rejection is a problem+json reason, and the object is deleted however the
// request ends unless the clip row took it.
import { createHash, randomUUID } from 'node:crypto';
import { Transform } from 'node:stream';
import type { Request, RequestHandler } from 'express';
import { fileTypeFromBuffer, fileTypeFromFile } from 'file-type';
import multer, { MulterError, type StorageEngine } from 'multer';
import { HttpProblem, badRequest } from '../http/problem';
import { MediaError, frameTimestamps, probe, type ProbeResult } from '../media/ffmpeg';
import { clipPrefix, isStorageUnavailable, type Storage } from '../storage/storage';

/** Bytes kept from the start of an upload to tell its container by content. */
const HEAD_BYTES = 64 * 1024;

/** What the storage engine adds to `req.file`. */
export interface ReceivedFile extends Express.Multer.File {
  sha256: string;
  /** The clip id chosen for this upload; its object lives under the clip's prefix. */
  clipId: string;
  /** Storage key of the uploaded bytes. */
  key: string;
  /** The first bytes of the file (up to 64 KiB). */
  head: Buffer;
  /** Set once a clip row owns the object; otherwise the object goes when the response ends. */
  kept?: boolean;
}

export const frameStoreUnavailable = () =>
  new HttpProblem(503, 'Storage unavailable', 'The frame store cannot be reached right now. Try again in a moment; frames already shown stay cached.');

export const storageUnavailable = () =>
  new HttpProblem(503, 'Storage unavailable', 'The clip store cannot be reached right now, so nothing was kept. Try the upload again in a few minutes.');

/** A multer storage engine streaming into `storage` and computing SHA-256 on the way through. */
export function hashingStoreEngine(storage: Storage): StorageEngine {
  return {
    _handleFile(req, file, cb) {
      const clipId = randomUUID();
      const key = `${clipPrefix(String(req.params.teamId), clipId)}original`;
      const hash = createHash('sha256');
      const headParts: Buffer[] = [];
      let headSize = 0;
      let size = 0;
      const tap = new Transform({
        transform(chunk: Buffer, _enc, done) {
          hash.update(chunk);
          size += chunk.length;
          if (headSize < HEAD_BYTES) {
            headParts.push(chunk.subarray(0, HEAD_BYTES - headSize));
            headSize += Math.min(chunk.length, HEAD_BYTES - headSize);
          }
          done(null, chunk);
        },
        flush(done) {
          // Over the limit: multer reports 413; the store must not complete the object.
          done((file.stream as { truncated?: boolean }).truncated ? new Error('the upload is over the size limit') : null);
        },
      });
      // A client that goes away mid-stream: the upload fails and nothing is kept.
      file.stream.once('error', (err) => tap.destroy(err));
      req.once('close', () => {
        if (!req.complete) tap.destroy(new Error('the upload was interrupted'));
      });
      storage
        .put(key, file.stream.pipe(tap))
        .then(() => cb(null, { clipId, key, size, sha256: hash.digest('hex'), head: Buffer.concat(headParts) } as Partial<ReceivedFile>))
        .catch(async (err: Error) => {
          await storage.delete(key).catch(() => {});
          cb(err);
        });
    },
    _removeFile(_req, file, cb) {
      const key = (file as Partial<ReceivedFile>).key;
      if (!key) return cb(null);
      storage.delete(key).then(() => cb(null), cb);
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
 * Middleware receiving the multipart `file` part (and text fields) into the
 * clip store. Deletes the stored object when the response ends unless the
 * handler marked the file `kept` (the clip row owns it).
 */
export function receiveClipUpload(storage: Storage, limitBytes: number): RequestHandler {
  const upload = multer({
    storage: hashingStoreEngine(storage),
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
      if (file?.key && !file.kept) void storage.delete(file.key).catch(() => {});
    });
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(tooLarge(limitBytes));
        if (err.code === 'LIMIT_UNEXPECTED_FILE') return next(badRequest(`Unexpected file field "${err.field}": send one clip in the field \`file\`.`));
        return next(badRequest(`The upload form is not as expected: ${err.message}.`));
      }
      const message = (err as Error)?.message ?? String(err);
      if (/interrupted|Unexpected end of form|aborted|Request closed/i.test(message)) return next(badRequest('The upload was interrupted before the file was complete. Try again.'));
      if (/Malformed part header|Multipart: Boundary not found/i.test(message)) return next(badRequest('The upload is not valid multipart/form-data.'));
      if (isStorageUnavailable(err)) return next(storageUnavailable());
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

/**
 * @param file what ffprobe opens: a path or a presigned URL (Storage.mediaInput)
 * @param head the file's first bytes, which say what it is (read from `file` when it is a path and head is not given)
 */
export async function inspectClip(file: string, sizeBytes: number, originalName: string, head?: Buffer): Promise<InspectedClip> {
  if (sizeBytes === 0) throw badRequest(`${originalName} is empty (0 bytes).`);
  const type = head ? await fileTypeFromBuffer(head) : await fileTypeFromFile(file);
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
