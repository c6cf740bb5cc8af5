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
