import { useEffect, useState } from 'react';
import { snapOnImage } from '../editor/canvas-snap';
import { createEditor, type Editor } from '../editor/editor-store';
import { DEFAULT_FRAME_CACHE, FrameCache, imageLoader } from '../editor/frame-cache';
import { frameImageUrl } from '@/api/clips/frame-images';

/** One editor and one frame cache per open clip; the snap reads the decoded frame the person is looking at. */
export function useWorkspaceEditor(teamId: string, clipId: string): { editor: Editor; frameCache: FrameCache<HTMLImageElement> } {
  const [pair] = useState(() => {
    const frameCache = new FrameCache(imageLoader((n) => frameImageUrl(teamId, clipId, n)), DEFAULT_FRAME_CACHE);
    const editor = createEditor({
      snap: (frameNumber, point) => {
        const image = frameCache.get(frameNumber);
        return image ? snapOnImage(image, point) : null;
      },
    });
    return { editor, frameCache };
  });
  useEffect(() => {
    // Handy when something looks wrong: the live editor from the browser console.
    if (import.meta.env.DEV) (window as unknown as { arcbenchEditor?: Editor }).arcbenchEditor = pair.editor;
  }, [pair.editor]);
  return pair;
}
