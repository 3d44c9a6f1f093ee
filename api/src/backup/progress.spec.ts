import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { archiveName } from './back-up';
import { bytesInWords, terminalReporter } from './progress';

describe('what a backup says as it goes', () => {
  it.each([
    [0, '0 bytes'],
    [1023, '1023 bytes'],
    [1024, '1.0 KB'],
    [1536, '1.5 KB'],
    [5 * 1024 * 1024, '5.0 MB'],
    [3.25 * 1024 ** 3, '3.3 GB'],
  ])('says %d bytes as %s', (n, words) => expect(bytesInWords(n)).toBe(words));

  it('says where a long step is at each quarter when the output is no terminal, and its end', () => {
    const lines: string[] = [];
    const out = { isTTY: false, write: (s: string) => lines.push(s) } as unknown as NodeJS.WriteStream;
    const reporter = terminalReporter(out);
    reporter.step('Copying 8 stored files…');
    const meter = reporter.meter('Copied', 8, 'files');
    for (let i = 0; i < 8; i++) meter.add(1);
    meter.done();
    expect(lines.join('')).toBe(
      [
        '▸ Copying 8 stored files…',
        '  Copied: 25% (2 of 8 files)',
        '  Copied: 50% (4 of 8 files)',
        '  Copied: 75% (6 of 8 files)',
        '  Copied: 100% (8 of 8 files)',
        '',
      ].join('\n'),
    );
  });

  it('names an archive by the minute it was made in UTC, and never reuses a name', () => {
    const dir = mkdtempSync(join(tmpdir(), 'crumbproof-archive-name-'));
    try {
      const at = new Date('2026-12-03T14:12:59.999Z');
      expect(archiveName(dir, at)).toBe('crumbproof-2026-12-03T1412Z.tar.gz');
      writeFileSync(join(dir, 'crumbproof-2026-12-03T1412Z.tar.gz'), '');
      writeFileSync(join(dir, 'crumbproof-2026-12-03T1412Z-2.tar.gz.partial'), '');
      expect(archiveName(dir, at)).toBe('crumbproof-2026-12-03T1412Z-3.tar.gz');
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
