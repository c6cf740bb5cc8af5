import { describe, expect, it } from 'vitest';
import type { ToolId } from './types';
import { reviewKeyAction } from './review-pass-key';

const here = { activeTool: 'place' as ToolId, hereNeedsReview: true, onControl: false };

describe('reviewKeyAction', () => {
  it('leaves Enter to the straight-edge tool while it is active, so one press does not also accept the shown mark', () => {
    expect(reviewKeyAction('Enter', { ...here, activeTool: 'straight-edge' })).toBeNull();
  });

  it('accepts the shown mark on Enter with any other tool', () => {
    const others: ToolId[] = ['place', 'ruler', 'origin-pin', 'horizon', 'plane-fix', 'hand'];
    for (const activeTool of others) expect(reviewKeyAction('Enter', { ...here, activeTool }), activeTool).toBe('accept');
  });

  it('does not accept on a frame with nothing to check, nor when Enter presses a focused button', () => {
    expect(reviewKeyAction('Enter', { ...here, hereNeedsReview: false })).toBeNull();
    expect(reviewKeyAction('Enter', { ...here, onControl: true })).toBeNull();
  });

  it('steps with . and , whatever the tool, and ignores other keys', () => {
    expect(reviewKeyAction('.', { ...here, activeTool: 'straight-edge' })).toBe('next');
    expect(reviewKeyAction(',', { ...here, hereNeedsReview: false })).toBe('previous');
    expect(reviewKeyAction('a', here)).toBeNull();
    expect(reviewKeyAction('Backspace', here)).toBeNull();
  });
});
