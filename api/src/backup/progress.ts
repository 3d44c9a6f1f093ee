/** How far a long step has gone: bytes or files done, out of a total when it is known. */
export interface Meter {
  add(n: number): void;
  done(): void;
}

/** Where a backup or a restore says what it is doing. */
export interface Reporter {
  /** A step begins. */
  step(text: string): void;
  /** A step that takes a while: its progress, out of `total` when known (0: not known). */
  meter(label: string, total: number, unit: 'bytes' | 'files'): Meter;
}

/** Bytes in words: `820 bytes`, `14.2 KB`, `3.1 MB` (1 KB = 1,024 bytes). */
export function bytesInWords(n: number): string {
  if (n < 1024) return `${n} bytes`;
  const units = ['KB', 'MB', 'GB', 'TB'];
  let value = n / 1024;
  let unit = 0;
  while (value >= 1024 && unit < units.length - 1) {
    value /= 1024;
    unit++;
  }
  return `${value.toFixed(1)} ${units[unit]}`;
}

const amount = (n: number, unit: 'bytes' | 'files') => (unit === 'bytes' ? bytesInWords(n) : `${n} file${n === 1 ? '' : 's'}`);

/** Says nothing (the tests, and a caller that reports on its own). */
export const silentReporter: Reporter = {
  step: () => {},
  meter: () => ({ add: () => {}, done: () => {} }),
};

/**
 * Progress on a terminal: each step on a line of its own, and a long step's line rewritten as it
 * goes (at most ten times a second). Where the output is no terminal (a log, a pipe) a long step
 * says where it is at each quarter, and what it did at its end.
 */
export function terminalReporter(out: NodeJS.WriteStream = process.stderr): Reporter {
  return {
    step: (text) => out.write(`▸ ${text}\n`),
    meter(label, total, unit) {
      let doneSoFar = 0;
      let shownAt = 0;
      let quarter = 0;
      const line = () => {
        if (total <= 0) return `  ${label}: ${amount(doneSoFar, unit)}`;
        const share = `${Math.min(100, Math.floor((doneSoFar / total) * 100))}%`;
        return unit === 'files'
          ? `  ${label}: ${share} (${doneSoFar} of ${amount(total, unit)})`
          : `  ${label}: ${share} (${amount(doneSoFar, unit)} of ${amount(total, unit)})`;
      };
      return {
        add(n) {
          doneSoFar += n;
          if (out.isTTY) {
            const now = Date.now();
            if (now - shownAt >= 100) {
              shownAt = now;
              out.write(`\r${line()}\x1b[K`);
            }
          } else if (total > 0 && Math.floor((doneSoFar / total) * 4) > quarter && doneSoFar < total) {
            quarter = Math.floor((doneSoFar / total) * 4);
            out.write(`${line()}\n`);
          }
        },
        done() {
          out.write(out.isTTY ? `\r${line()}\x1b[K\n` : `${line()}\n`);
        },
      };
    },
  };
}
