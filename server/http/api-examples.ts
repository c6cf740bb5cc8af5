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
