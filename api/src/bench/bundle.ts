import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';

/**
 * The gzipped JavaScript the sign-in page loads: every script and module preload its index.html
 * names, from the built web app (npm run build). The end-to-end test tests/e2e/first-load.test.ts
 * measures the same in Chromium and holds it under 200 KB.
 */
export function signInBundleKb(): number | null {
  const dist = join(__dirname, '..', '..', '..', 'web', 'dist');
  if (!existsSync(join(dist, 'index.html'))) return null;
  const html = readFileSync(join(dist, 'index.html'), 'utf8');
  const files = [...html.matchAll(/(?:src|href)="\/assets\/([^"]+\.js)"/g)].map((m) => m[1]);
  const bytes = files.reduce((sum, f) => sum + gzipSync(readFileSync(join(dist, 'assets', f))).length, 0);
  return bytes / 1024;
}
