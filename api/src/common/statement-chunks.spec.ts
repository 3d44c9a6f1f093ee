import { jsonBytes, statementChunks } from './statement-chunks';

describe('statementChunks', () => {
  const item = (n: number, chars: number) => ({ n, body: { text: 'x'.repeat(chars) } });

  it('keeps every item once, in order, within the count and the byte budget', () => {
    const items = Array.from({ length: 25 }, (_, n) => item(n, 90)); // each body is 101 bytes of JSON
    const chunks = statementChunks(items, (i) => jsonBytes(i.body), 10, 350);
    expect(chunks.flat()).toEqual(items);
    expect(chunks.map((c) => c.length)).toEqual([3, 3, 3, 3, 3, 3, 3, 3, 1]);
  });

  it('stops at the count when the bodies are small', () => {
    const chunks = statementChunks(
      Array.from({ length: 7 }, (_, n) => item(n, 1)),
      (i) => jsonBytes(i.body),
      3,
      1_000_000,
    );
    expect(chunks.map((c) => c.length)).toEqual([3, 3, 1]);
  });

  it('sends an item larger than the budget alone rather than never', () => {
    const chunks = statementChunks([item(0, 10), item(1, 5000), item(2, 10)], (i) => jsonBytes(i.body), 10, 1000);
    expect(chunks.map((c) => c.map((i) => i.n))).toEqual([[0], [1], [2]]);
  });

  it('counts bytes as UTF-8 sends them, not characters', () => {
    // 'é' is two bytes: 60 of them are 120 bytes, plus {"text":""} (11).
    const chunks = statementChunks(
      [item(0, 0), item(1, 0)].map((i) => ({ ...i, body: { text: 'é'.repeat(60) } })),
      (i) => jsonBytes(i.body),
      10,
      200,
    );
    expect(chunks).toHaveLength(2);
  });
});
