import type { SourceEntry } from './book';
import { sourceOf } from './source-entry';

describe('sourceOf', () => {
  it.each<[SourceEntry, string]>([
    ['milk', 'milk'],
    [{ source: 'wheat', form: 'glucose-syrup' }, 'wheat'],
    [{ source: 'fish', species: 'cod' }, 'fish'],
    [{ source: 'soy', form: 'refined-oil', species: 'soya bean' }, 'soy'],
  ])('reads %j as %s', (entry, source) => {
    expect(sourceOf(entry)).toBe(source);
  });
});
