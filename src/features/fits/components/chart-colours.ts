// The palette of DEVELOPERS.md "Look and feel": amber for what a person did
// (marks), teal for the model, violet dashed for drag-free, red for outliers.
export const CHART = {
  marks: '#d9822b',
  fit: '#1f7a72',
  dragFree: '#7a6fa8',
  outlier: '#b3261e',
  grid: '#e2dccf',
  ink: '#3d4a5c',
} as const;
