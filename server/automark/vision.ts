// The one door to the tracking core (server/vision, see
// /work/team/automark-interface.md for the contract). Everything in this
// area imports autoMarkTrack and its types from here.
export { autoMarkTrack } from '../vision/auto-mark-track';
export type { AutoMark, AutoMarkOptions, AutoMarkOutcome, FrameSource, GrayFrame } from '../vision/auto-mark-track';
