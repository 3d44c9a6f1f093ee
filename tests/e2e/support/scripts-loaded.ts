import { gzipSync } from 'node:zlib';
import type { Page } from 'playwright-core';

export interface LoadedScript {
  /** The file name under /assets/, e.g. framework-D0nE.js. */
  file: string;
  /** Its size gzipped at the default level, in bytes, as a browser would download it compressed. */
  gzipBytes: number;
}

/**
 * Records every JavaScript file the page downloads from now on. `take()` waits for the network to
 * settle and returns what came, each file once.
 */
export function recordScripts(page: Page): { take: () => Promise<LoadedScript[]> } {
  const seen = new Map<string, Promise<LoadedScript>>();
  page.on('response', (response) => {
    const url = new URL(response.url());
    if (!response.ok() || !url.pathname.endsWith('.js') || seen.has(url.pathname)) return;
    // A page that moves on at once (the kitchen choice restarting the app) leaves no body to read:
    // the same file is asked for again, as the browser downloaded it.
    const body = response.body().catch(() => page.request.get(url.href).then((again) => again.body()));
    seen.set(
      url.pathname,
      body.then((bytes) => ({ file: url.pathname.split('/').pop()!, gzipBytes: gzipSync(bytes).length })),
    );
  });
  return {
    take: async () => {
      await page.waitForLoadState('networkidle');
      return Promise.all(seen.values());
    },
  };
}

export const totalKb = (scripts: LoadedScript[]) => scripts.reduce((sum, s) => sum + s.gzipBytes, 0) / 1024;
