import type { AllergenSource } from './allergens';
import type { SourceEntry } from './book';

/** The allergen source an entry of a contains or may-contain list names: 'milk', or { source: 'wheat', form: 'glucose-syrup' } → 'wheat'. */
export function sourceOf(entry: SourceEntry): AllergenSource {
  return typeof entry === 'string' ? entry : entry.source;
}
