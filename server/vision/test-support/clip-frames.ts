// Test support: a generated clip's frames as the product sees them. The clip
// is extracted to JPEG by server/media/ffmpeg.ts (as the extraction job does)
// and each frame is decoded to 8-bit luma by sharp, behind a FrameSource.
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import sharp from 'sharp';
import type { GeneratedClip } from '../../fixtures/clip-generator';
import { extractFrames, frameFileName } from '../../media/ffmpeg';
import type { FrameSource, GrayFrame } from '../types';

/** server/config.ts default for JPEG_QUALITY (the unit project has no server environment to read it from). */
export const SERVER_DEFAULT_JPEG_QUALITY = 90;

export async function extractClipFrames(clip: GeneratedClip, outDir: string, jpegQuality = SERVER_DEFAULT_JPEG_QUALITY): Promise<string> {
  await mkdir(outDir, { recursive: true });
  await extractFrames({ input: clip.videoPath, outDir, inFrame: 0, outFrame: clip.truth.frameCount - 1, jpegQuality });
  return outDir;
}

export async function decodeGray(file: string): Promise<{ width: number; height: number; data: Uint8Array }> {
  const { data, info } = await sharp(file).greyscale().raw().toBuffer({ resolveWithObject: true });
  return { width: info.width, height: info.height, data: new Uint8Array(data.buffer, data.byteOffset, data.length) };
}

/** A FrameSource over a folder of extracted JPEG frames (decoded on every read, as a job would). */
export function jpegFrameSource(dir: string, frameCount: number, width: number, height: number, onRead?: (n: number) => void): FrameSource {
  return {
    frameCount,
    width,
    height,
    async read(frameNumber: number): Promise<GrayFrame> {
      onRead?.(frameNumber);
      const g = await decodeGray(path.join(dir, frameFileName(frameNumber)));
      return { frameNumber, ...g };
    },
  };
}
