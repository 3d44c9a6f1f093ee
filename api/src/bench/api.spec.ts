import { bookFileSchema } from '@crumbproof/shared';
import { syntheticKitchen } from '../rules/core/testing/synthetic-kitchen';
import { standardBookFor } from './api';

describe('the standard book as the API bench imports it', () => {
  const standard = syntheticKitchen('standard');

  it('names the kitchen by its book id where the installation has several (the demo has two)', () => {
    const file = bookFileSchema.parse(JSON.parse(standardBookFor('wrenfield-lane')));
    expect(file.site).toBeUndefined();
    expect(file.sites).toEqual([{ ...standard.site, id: 'wrenfield-lane' }]);
    expect(file.recipes).toHaveLength(standard.recipes.length);
    expect(file.ingredients).toHaveLength(standard.ingredients.length);
  });

  it('gives the one kitchen as site where it has no book id', () => {
    const file = bookFileSchema.parse(JSON.parse(standardBookFor(null)));
    expect(file.sites).toBeUndefined();
    expect(file.site).toEqual(standard.site);
  });
});
