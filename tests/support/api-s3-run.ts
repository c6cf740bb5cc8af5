// What a test file needs to know about the S3 run (project api-s3), from the
// values tests/support/api-s3-global-setup.ts provides. Null in every other project.
import { mkdtempSync } from 'node:fs';
import path from 'node:path';
import { inject } from 'vitest';
import type { ArcbenchS3Context } from './api-s3-global-setup';

export interface S3Run extends ArcbenchS3Context {
  /** A fresh folder under the run's local storage root (which must stay empty). */
  newLocalStorageDir(label: string): string;
}

export function s3Run(): S3Run | null {
  const ctx = inject('arcbenchS3') as ArcbenchS3Context | undefined;
  if (!ctx) return null;
  return { ...ctx, newLocalStorageDir: (label) => mkdtempSync(path.join(ctx.localStorageRoot, `${label}-`)) };
}
