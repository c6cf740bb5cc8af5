// Copies every object from one storage to another: moving an installation
// from local disk to an object store, and giving the S3 test run the demo
// seed's clips. Run as `npx tsx server/storage/copy-objects.ts <STORAGE_DIR>`
// with STORAGE_URL and the S3 settings of the target in the environment.
import { pathToFileURL } from 'node:url';
import { loadConfig } from '../config';
import { createStorage } from './create-storage';
import { localDiskStorage } from './local-disk';
import type { Storage } from './storage';

/** Copies the objects under `prefix` (all by default); returns how many. Existing targets are overwritten. */
export async function copyObjects(from: Storage, to: Storage, prefix = ''): Promise<number> {
  const keys = await from.list(prefix);
  let next = 0;
  const lanes = Array.from({ length: Math.min(8, keys.length) }, async () => {
    while (next < keys.length) {
      const key = keys[next++];
      await to.put(key, await from.get(key));
    }
  });
  await Promise.all(lanes);
  return keys.length;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const source = process.argv[2];
  if (!source) {
    process.stderr.write('usage: npx tsx server/storage/copy-objects.ts <local STORAGE_DIR>  (target: STORAGE_URL and S3_* settings)\n');
    process.exit(2);
  }
  const config = loadConfig();
  if (config.storage.kind !== 's3') {
    process.stderr.write('Set STORAGE_URL=s3://bucket/prefix (and the S3_*/AWS_* settings) for the target store.\n');
    process.exit(2);
  }
  const n = await copyObjects(localDiskStorage(source), createStorage(config));
  process.stdout.write(`copied ${n} objects from ${source} to s3://${config.storage.bucket}/${config.storage.prefix}\n`);
}
