import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useRef, useState } from 'react';
import type { ClipView } from '@shared/schemas/clips';
import { ApiError, type ProblemField } from '@/lib/api-client';
import { invalidateClipStatus } from './clip-views';

export interface ClipUploadInput {
  file: File;
  /** Frames per second the camera recorded at (not what the file plays at). */
  captureFps: number;
  inFrame?: number;
  outFrame?: number;
}

export interface UploadProgress {
  sentBytes: number;
  totalBytes: number;
}

/**
 * Uploads with XMLHttpRequest because fetch reports no upload progress, and a
 * clip can be gigabytes. Rejects with ApiError built from the problem document,
 * a TypeError when the network fails, or an AbortError when cancelled.
 */
export function uploadClip(teamId: string, shotId: string, input: ClipUploadInput, onProgress: (p: UploadProgress) => void, signal?: AbortSignal): Promise<ClipView> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    // Text fields first: the server reads them before it streams the file to disk.
    form.append('captureFps', String(input.captureFps));
    if (input.inFrame !== undefined) form.append('inFrame', String(input.inFrame));
    if (input.outFrame !== undefined) form.append('outFrame', String(input.outFrame));
    form.append('file', input.file, input.file.name);

    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/teams/${teamId}/shots/${shotId}/clips`);
    xhr.setRequestHeader('X-Arcbench-Request', '1');
    xhr.responseType = 'text';
    xhr.upload.onprogress = (e) => onProgress({ sentBytes: e.loaded, totalBytes: e.lengthComputable ? e.total : input.file.size });
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) {
        try {
          resolve(JSON.parse(xhr.responseText) as ClipView);
        } catch {
          reject(new ApiError(xhr.status, 'Unexpected answer', 'The server accepted the clip but its answer could not be read. Reload the page.'));
        }
        return;
      }
      reject(problemOf(xhr));
    };
    xhr.onerror = () => reject(new TypeError('The upload was interrupted: the connection to the server failed.'));
    xhr.onabort = () => reject(new DOMException('Upload cancelled', 'AbortError'));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}

function problemOf(xhr: XMLHttpRequest): ApiError {
  try {
    const p = JSON.parse(xhr.responseText) as { title?: string; detail?: string; errors?: ProblemField[] };
    return new ApiError(xhr.status, p.title ?? xhr.statusText, p.detail ?? '', p.errors ?? []);
  } catch {
    return new ApiError(xhr.status, xhr.statusText || 'Upload failed', xhr.responseText.slice(0, 200) || `The upload failed (${xhr.status}).`);
  }
}

/** Upload with live byte progress and a cancel. */
export function useUploadClip(teamId: string, shotId: string) {
  const client = useQueryClient();
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const abort = useRef<AbortController | null>(null);
  const mutation = useMutation({
    mutationFn: (input: ClipUploadInput) => {
      abort.current = new AbortController();
      setProgress({ sentBytes: 0, totalBytes: input.file.size });
      return uploadClip(teamId, shotId, input, setProgress, abort.current.signal);
    },
    onSettled: () => {
      abort.current = null;
      return invalidateClipStatus(client, teamId);
    },
  });
  return { ...mutation, progress, cancel: () => abort.current?.abort() };
}
