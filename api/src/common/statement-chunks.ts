/**
 * The most bytes of JSON bodies one multi-row statement carries: a quarter of MariaDB's default
 * max_allowed_packet (16 MiB since 10.2), so that a statement is never refused for its size.
 */
export const STATEMENT_BODY_BYTES = 4 * 1024 * 1024;

/**
 * Splits items into runs for multi-row statements: at most `most` items, and at most `budget`
 * bytes of bodies in each (`bytesOf`, e.g. jsonBytes). An item larger than the budget goes alone.
 */
export function statementChunks<T>(items: readonly T[], bytesOf: (item: T) => number, most: number, budget = STATEMENT_BODY_BYTES): T[][] {
  const chunks: T[][] = [];
  let current: T[] = [];
  let bytes = 0;
  for (const item of items) {
    const size = bytesOf(item);
    if (current.length > 0 && (current.length >= most || bytes + size > budget)) {
      chunks.push(current);
      current = [];
      bytes = 0;
    }
    current.push(item);
    bytes += size;
  }
  if (current.length > 0) chunks.push(current);
  return chunks;
}

/** A body's size as a statement sends it: its JSON in UTF-8. */
export const jsonBytes = (body: unknown): number => Buffer.byteLength(JSON.stringify(body) ?? '', 'utf8');
