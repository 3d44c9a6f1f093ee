// After each test file: its uploads folder (test/support/env.ts) goes.
import { rmSync } from 'node:fs';

const uploads = process.env.STORAGE_DIR;
afterAll(() => {
  if (uploads?.includes('crumbproof-test-uploads-')) rmSync(uploads, { recursive: true, force: true });
});
