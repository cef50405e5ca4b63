// Temporary folders for tests that write files: made under the system's temp folder, removed afterwards.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeEach } from 'vitest';

/** A temporary folder for the calling test file, removed after all its tests. */
export function tempRoot(prefix: string): string {
  const root = fs.mkdtempSync(path.join(os.tmpdir(), prefix));
  afterAll(() => fs.rmSync(root, { recursive: true, force: true }));
  return root;
}

/** A fresh empty folder for each test (read `.dir` inside the test), all inside one tempRoot. */
export function folderPerTest(prefix: string): { readonly dir: string } {
  const root = tempRoot(prefix);
  let dir = root;
  let n = 0;
  beforeEach(() => {
    dir = path.join(root, `case-${++n}`);
    fs.mkdirSync(dir);
  });
  return {
    get dir() {
      return dir;
    },
  };
}
