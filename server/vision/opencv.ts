// The only module that loads OpenCV (the WebAssembly build from npm,
// @techstark/opencv-js). Loading compiles a ~10 MB wasm module (a few seconds),
// so it happens once per process and every caller shares the same promise.
//
// Why not `await import(...)`: the Emscripten module object carries a `then`
// method, so awaiting it (or resolving a promise with it) recurses forever.
// We wait for `onRuntimeInitialized`, then drop that `then` so the ready
// module is a plain object that promises can carry.
import { createRequire } from 'node:module';

export type OpenCv = typeof import('@techstark/opencv-js');

interface EmscriptenModule {
  Mat?: unknown;
  then?: unknown;
  calledRun?: boolean;
  onRuntimeInitialized?: () => void;
}

let loading: Promise<{ cv: OpenCv }> | null = null;

function loadOnce(): Promise<{ cv: OpenCv }> {
  const require = createRequire(import.meta.url);
  const mod = require('@techstark/opencv-js') as EmscriptenModule;
  return new Promise((resolve, reject) => {
    const done = () => {
      delete mod.then;
      resolve({ cv: mod as unknown as OpenCv });
    };
    if (typeof mod.Mat === 'function' && mod.calledRun) return done();
    const previous = mod.onRuntimeInitialized;
    const timer = setTimeout(() => reject(new Error('OpenCV did not initialise within 60 s')), 60_000);
    timer.unref();
    mod.onRuntimeInitialized = () => {
      clearTimeout(timer);
      previous?.();
      done();
    };
  });
}

/** Resolves with OpenCV once its runtime is ready; the first call starts loading, later calls share it. */
export async function loadOpenCv(): Promise<OpenCv> {
  loading ??= loadOnce().catch((err) => {
    loading = null;
    throw err;
  });
  return (await loading).cv;
}
