// Worked examples of the main flows for the API reference: sign in, upload a
// clip, calibrate it, mark a frame, run a fit, approve it. Ids and names are
// invented (the demo team's); tests/api/openapi.test.ts validates every example
// against the schema it illustrates, so an example cannot drift from the contract.

const TEAM_ID = '5b0e6f1a-2c7d-4e94-8a3b-1f6d2c9e0a47';

export const SIGN_IN_EXAMPLE = {
  request: { email: 'tomas.reyes@ollendry.test', password: 'correct horse battery' },
  response: {
    id: '0c4d8e2f-6a1b-4c73-9e25-d8f0a6b3c194',
    email: 'tomas.reyes@ollendry.test',
    displayName: 'Tomas Reyes',
    notificationMode: 'each',
    teams: [{ id: TEAM_ID, name: 'Ollendry Line Works', slug: 'ollendry-line-works', siteName: 'Wendlow Flats test field', role: 'analyst' }],
  },
};

const SHOT_ID = '9a7e4c21-5b3d-4f60-8e12-7c4b9d0a3e58';
const CLIP_ID = 'd41c7b09-3e8f-4a25-b6d0-5f2e9c81a736';
const ANALYST_ID = SIGN_IN_EXAMPLE.response.id;

/** Multipart fields beside the file part; the answer is the clip, queued for extraction. */
export const CLIP_UPLOAD_EXAMPLE = {
  request: { file: '(the clip’s bytes: shot-07.mp4)', captureFps: '240' },
  response: {
    id: CLIP_ID,
    teamId: TEAM_ID,
    shotId: SHOT_ID,
    originalName: 'shot-07.mp4',
    sha256: '6f1d2a9c0b8e7f34a5c61d09e2b7f4a8c3d5e6f70192a3b4c5d6e7f8091a2b3c',
    sizeBytes: 18_734_112,
    codec: 'h264',
    formatName: 'mov,mp4,m4a,3gp,3g2,mj2',
    width: 1280,
    height: 720,
    rotationDeg: 0,
    frameWidth: 1280,
    frameHeight: 720,
    containerFps: 30,
    captureFps: 240,
    frameCount: 412,
    durationS: 13.733,
    variableFrameRate: false,
    warnings: [{ code: 'rate-differs', message: 'The file plays at 30 fps; frame times use the stated capture rate of 240 fps.' }],
    inFrame: 0,
    outFrame: 411,
    shutterS: null,
    frameStamp: 'middle',
    exposureShiftS: 0,
    status: 'queued',
    progress: 0,
    error: null,
    waitingFor: null,
    extractedCount: 0,
    thumbnailCount: 0,
    duplicateOf: null,
    createdBy: ANALYST_ID,
    createdAt: '2026-04-18T09:42:11.204Z',
    updatedAt: '2026-04-18T09:42:11.204Z',
  },
};

const TOMAS = { id: ANALYST_ID, displayName: 'Tomas Reyes' };

/** A 2.000 m bar (±2 mm) 1000 px long, origin at the muzzle, a level line along the berm top; no plane, lens or offset correction. */
export const CALIBRATE_EXAMPLE = {
  request: {
    scale: { p1: { u: 100, v: 600 }, p2: { u: 1100, v: 600 }, lengthM: 2, lengthTolM: 0.002, endpointSigmaPx: 0.5 },
    origin: { u: 140, v: 610 },
    level: { kind: 'line', p1: { u: 80, v: 655 }, p2: { u: 1180, v: 655 } },
    downrange: 'right',
    note: 'Bar on the stand at the muzzle, 09:50',
  },
  response: {
    id: '7e2b9d40-1c5f-4a86-b3e7-0d9c6f2a8b15',
    clipId: CLIP_ID,
    version: 1,
    scale: { p1: { u: 100, v: 600 }, p2: { u: 1100, v: 600 }, lengthM: 2, lengthTolM: 0.002, endpointSigmaPx: 0.5 },
    origin: { u: 140, v: 610 },
    level: { kind: 'line', p1: { u: 80, v: 655 }, p2: { u: 1180, v: 655 } },
    downrange: 'right',
    plane: null,
    rollDeg: 0,
    rollStdUncertaintyDeg: 0.037,
    lens: null,
    planeOffset: null,
    pixelsPerMetre: 500,
    scaleRelUncertainty: 0.00091,
    note: 'Bar on the stand at the muzzle, 09:50',
    createdBy: TOMAS,
    createdAt: '2026-04-18T09:55:02.418Z',
  },
};

/** Placing a new mark on frame 120 (expectedRevision null: create only); times and places come from the clip's frame table and current calibration. */
export const MARK_PUT_EXAMPLE = {
  request: { uPx: 640.5, vPx: 310, snapped: false, expectedRevision: null },
  response: {
    mark: {
      frameNumber: 120,
      uPx: 640.5,
      vPx: 310,
      placedUPx: 640.5,
      placedVPx: 310,
      snapped: false,
      source: 'hand',
      confidence: null,
      lowConfidenceReason: null,
      revision: 18,
      updatedBy: TOMAS,
      updatedAt: '2026-04-18T10:03:27.902Z',
      tS: 0.5,
      xM: 1.001,
      yM: 0.6,
    },
    trackRevision: 18,
    created: true,
  },
};
