import { bookSchema } from '@crumbproof/shared';
import demo from '../database/seeders/demo-book.json';
import { declareProducts } from '../rules/core';
import { loadReferenceData } from '../rules/reference-data';
import { indentedJsonPieces } from './json-lines';

const text = (key: string, items: unknown[]) => [...indentedJsonPieces(key, items)].join('');

describe('the declarations written a piece at a time', () => {
  it('are exactly the indented JSON of the whole', () => {
    const out = declareProducts(bookSchema.parse(demo), loadReferenceData());
    expect(text('declarations', out.declarations)).toBe(`${JSON.stringify(out, null, 2)}\n`);
  });

  it('write an empty list, a single item, and texts with line breaks and quotes as JSON does', () => {
    for (const items of [[], [1], [{ a: 'x\ny "z"', b: [[], {}, [1, { c: null }]] }, 'two']]) {
      expect(text('declarations', items)).toBe(`${JSON.stringify({ declarations: items }, null, 2)}\n`);
    }
  });

  it('reads items made as they are read one at a time, holding at most the one being written and the next', () => {
    let made = 0;
    function* numbers() {
      for (let n = 0; n < 5; n++) {
        made++;
        yield { n };
      }
    }
    const pieces: string[] = [];
    for (const piece of indentedJsonPieces('declarations', numbers())) {
      pieces.push(piece);
      // The opening and each item written so far, plus the one read ahead.
      expect(made).toBeLessThanOrEqual(pieces.length);
    }
    expect(pieces.join('')).toBe(`${JSON.stringify({ declarations: [0, 1, 2, 3, 4].map((n) => ({ n })) }, null, 2)}\n`);
  });
});
