import { describe, expect, it } from 'vitest';
import { fitToWindow, imageToScreen, panTransition, screenToImage, zoomAtCursor, type PanState } from './view-behaviour';

describe('view behaviour', () => {
  it('fits a 1280x720 frame into 800x600 by width and centres it vertically', () => {
    const v = fitToWindow({ width: 1280, height: 720 }, { width: 800, height: 600 }, 0);
    expect(v.zoom).toBeCloseTo(0.625, 12);
    expect(v.panX).toBeCloseTo(0, 12);
    expect(v.panY).toBeCloseTo((600 - 450) / 2, 12);
  });

  it('screen and image coordinates are inverse', () => {
    const v = { zoom: 2.5, panX: -30, panY: 12 };
    const p = screenToImage(v, imageToScreen(v, { u: 123.25, v: 45.5 }));
    expect(p.u).toBeCloseTo(123.25, 12);
    expect(p.v).toBeCloseTo(45.5, 12);
  });

  it('zooming keeps the image point under the cursor fixed', () => {
    const v = { zoom: 1, panX: 10, panY: 20 };
    const cursor = { x: 300, y: 200 };
    const before = screenToImage(v, cursor);
    const z = zoomAtCursor(v, cursor, 3);
    expect(z.zoom).toBe(3);
    const after = screenToImage(z, cursor);
    expect(after.u).toBeCloseTo(before.u, 10);
    expect(after.v).toBeCloseTo(before.v, 10);
  });

  it('middle button pans; left button pans only with Space or the hand tool', () => {
    const view = { zoom: 1, panX: 0, panY: 0 };
    const still: PanState = { phase: 'still' };
    expect(panTransition(still, { type: 'press', screen: { x: 0, y: 0 }, button: 0, spaceHeld: false, handTool: false }, view).claimed).toBe(false);
    const down = panTransition(still, { type: 'press', screen: { x: 5, y: 5 }, button: 1, spaceHeld: false, handTool: false }, view);
    expect(down.claimed).toBe(true);
    const moved = panTransition(down.state, { type: 'move', screen: { x: 25, y: -5 } }, view);
    expect(moved.view).toEqual({ zoom: 1, panX: 20, panY: -10 });
    expect(panTransition(moved.state, { type: 'release' }, moved.view).state.phase).toBe('still');
    expect(panTransition(still, { type: 'press', screen: { x: 0, y: 0 }, button: 0, spaceHeld: true, handTool: false }, view).claimed).toBe(true);
  });
});
