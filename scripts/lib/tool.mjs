import path from 'node:path';

/** Path of a binary installed by npm in node_modules/.bin. */
export function bin(root, name) {
  return path.join(root, 'node_modules', '.bin', name);
}
