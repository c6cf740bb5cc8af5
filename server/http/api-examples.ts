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
  request: { file: '(the clip’s bytes: shot-07.mp4)', captureFps: 240 },
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
    levelUncertainty: { endpointSigmaPx: 0.5 },
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

const FIT_ID = 'b38f0e6a-94d2-4c1b-8a7f-2e65d10c9b43';
const TRACK_ID = 'e5a21c7d-08b4-4f93-a6e2-3c9d7b150f68';
const CALIBRATION_ID = CALIBRATE_EXAMPLE.response.id;
const DEV = { id: '2a9f4e17-6c0b-4d58-9e31-b7c8a5d2f604', displayName: 'Dev Okafor' };
const estimate = (value: number, stdErr: number) => ({ value, stdErr, ci95: [Math.round((value - 1.96 * stdErr) * 1e4) / 1e4, Math.round((value + 1.96 * stdErr) * 1e4) / 1e4] });

/** A stored fit as the run answers it (abridged: the result and snapshot carry more fields than shown, see the schema). */
const FIT_DETAIL = {
  id: FIT_ID,
  shotId: SHOT_ID,
  trackId: TRACK_ID,
  state: 'awaiting-review',
  launchSpeedMps: 23.41,
  launchAngleDeg: 44.62,
  dragCoefficient: 0.47,
  dragK_perM: 0.0112,
  rmsResidualM: 0.0041,
  dragVerdict: 'Drag resolved: the drag model fits clearly better than the drag-free parabola.',
  inputsChanged: false,
  createdBy: TOMAS,
  createdAt: '2026-04-18T10:21:40.117Z',
  reviewedBy: null,
  reviewedAt: null,
  teamId: TEAM_ID,
  clipId: CLIP_ID,
  calibrationId: CALIBRATION_ID,
  calibrationVersion: 1,
  marksRevision: 42,
  inputHash: 'c1f6a0d94e7b28356fa1e0c9d7b4a3821f5e6d0c9b8a7f6e5d4c3b2a19087f6e',
  reviewNote: null,
  staleness: { inputsChanged: false, marksChanged: false, calibrationChanged: false, currentMarksRevision: 42, currentCalibrationVersion: 1, message: null },
  shot: { id: SHOT_ID, label: 'OL-40 shot 7', seriesName: 'Wendlow Flats morning', launcherName: 'OL-40 line thrower', projectileName: 'Training head 250 g' },
  result: {
    model: 'quadratic-drag',
    tRefS: 0.5,
    x0M: estimate(1.001, 0.002),
    y0M: estimate(0.6, 0.002),
    launchSpeedMps: estimate(23.41, 0.16),
    launchAngleDeg: estimate(44.62, 0.21),
    dragK_perM: estimate(0.0112, 0.0014),
    dragCoefficient: estimate(0.47, 0.06),
    rmsResidualM: 0.0041,
    dragResolved: true,
    dragVerdict: 'Drag resolved: the drag model fits clearly better than the drag-free parabola.',
    degreesOfFreedom: 37,
    parameterNames: ['x0M', 'y0M', 'vx0Mps', 'vy0Mps', 'dragK_perM'],
    correlation: [
      [1, 0.1, -0.6, 0, 0.2],
      [0.1, 1, 0, -0.6, 0.1],
      [-0.6, 0, 1, 0.1, -0.7],
      [0, -0.6, 0.1, 1, -0.3],
      [0.2, 0.1, -0.7, -0.3, 1],
    ],
    residuals: [{ tS: 0.5, xResidualM: 0.0021, yResidualM: -0.0034, outlier: false }],
    outlierCount: 0,
    cautions: [],
    iterations: 7,
    converged: true,
  },
  snapshot: {
    schemaVersion: 1,
    marks: [{ frameNumber: 120, tS: 0.5, uPx: 640.5, vPx: 310, xM: 1.001, yM: 0.6 }],
    fitInput: { marks: [{ tS: 0.5, xM: 1.001, yM: 0.6 }], massKg: 0.25, diameterM: 0.04, airDensityKgM3: 1.204 },
  },
  audit: [{ action: 'fit.run', actor: TOMAS, at: '2026-04-18T10:21:40.117Z', detail: { trackId: TRACK_ID } }],
  sameInputsAs: null,
};

/** Running the fit of a marked track (no body); the answer is the stored fit, awaiting review. */
export const FIT_RUN_EXAMPLE = { response: FIT_DETAIL };

/** An engineer approves the fit (a rejection needs a note); the fit is then frozen. */
export const FIT_REVIEW_EXAMPLE = {
  request: { decision: 'approve', note: 'Residuals flat, Cd in the handbook range for a blunt head.' },
  response: {
    ...FIT_DETAIL,
    state: 'approved',
    reviewedBy: DEV,
    reviewedAt: '2026-04-18T11:02:13.550Z',
    reviewNote: 'Residuals flat, Cd in the handbook range for a blunt head.',
    audit: [...FIT_DETAIL.audit, { action: 'fit.approve', actor: DEV, at: '2026-04-18T11:02:13.550Z', detail: { note: 'Residuals flat, Cd in the handbook range for a blunt head.' } }],
  },
};
