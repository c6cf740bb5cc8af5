// `npm run fixtures`: renders every synthetic shot clip preset with its truth
// file into fixtures/generated/ (git-ignored). Tests render their own at test time.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { CLIP_PRESETS, generatePreset, type ClipPreset } from '../server/fixtures/clip-generator';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const outDir = path.join(root, 'fixtures', 'generated');
const wanted = process.argv.slice(2).filter((a) => !a.startsWith('-'));
const presets = (wanted.length > 0 ? wanted : CLIP_PRESETS) as ClipPreset[];

for (const preset of presets) {
  if (!CLIP_PRESETS.includes(preset)) {
    process.stderr.write(`unknown preset ${preset}; choose from ${CLIP_PRESETS.join(', ')}\n`);
    process.exit(2);
  }
  const started = Date.now();
  const clip = await generatePreset(preset, outDir);
  process.stdout.write(
    `${path.relative(root, clip.videoPath)}  ${clip.truth.frameCount} frames, ${clip.truth.width}×${clip.truth.height}, captured ${clip.truth.captureFps} fps, plays ${clip.truth.containerFps} fps  (${Date.now() - started} ms)\n`,
  );
}
