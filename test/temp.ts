/** Temporary folders for a test file, removed when the file is done. */
import { mkdtempSync, rmSync } from 'node:fs';
import { afterAll } from 'vitest';

/** A mkdtemp whose folders are removed after the calling test file's tests (call it at the file's top level). */
export function tempFolders(): (prefix: string) => string {
  const made: string[] = [];
  afterAll(() => {
    for (const d of made) rmSync(d, { recursive: true, force: true });
  });
  return (prefix) => {
    const d = mkdtempSync(prefix);
    made.push(d);
    return d;
  };
}
