import { loadReferenceData } from '../reference-data';
import { scanComposition } from './composition-scan';

const { lexicon } = loadReferenceData();
const sources = (text: string) => [...new Set(scanComposition(text, lexicon).allergens.map((h) => h.source))].sort();

describe('scanComposition', () => {
  // Names of allergen-bearing ingredients: common trade usage (common practice).
  it.each([
    { text: 'Sugar, cocoa mass, whey powder, emulsifier', found: ['milk'] },
    { text: 'Buttermilk, salt', found: ['milk'] },
    { text: 'Sodium caseinate', found: ['milk'] },
    { text: 'Pasteurised egg albumen', found: ['egg'] },
    { text: 'Durum wheat semolina', found: ['wheat'] },
    { text: 'Wholegrain spelt flour', found: ['spelt'] },
    { text: 'Tahini (ground sesame seeds)', found: ['sesame'] },
    { text: 'Soya lecithin', found: ['soy'] },
    { text: 'Marzipan (sugar, almonds)', found: ['almond'] },
    { text: 'Peanut butter', found: ['peanut'] },
    { text: 'Barley malt extract', found: ['barley'] },
    { text: 'Preservative: sodium metabisulphite', found: ['sulphites'] },
    { text: 'Dried apricots, preservative (E220)', found: ['sulphites'] },
    { text: 'Milk chocolate', found: ['milk'] },
    { text: 'Free-range EGGS', found: ['egg'] },
    { text: 'Rolled oats', found: ['oats'] },
    { text: 'Coconut milk (coconut extract, water)', found: ['coconut'] },
  ])('finds $found in "$text"', ({ text, found }) => {
    expect(sources(text)).toEqual(found);
  });

  // Look-alikes that are not hits (word boundaries and the lexicon's exceptions; common practice).
  it.each([
    { text: 'Cocoa butter, sugar' },
    { text: 'Shea butter' },
    { text: 'Sunflower lecithin' },
    { text: 'Buckwheat flour' },
    { text: 'Nutmeg, cinnamon' },
    { text: 'Roasted butternut squash' },
    { text: 'Cream of tartar' },
    { text: 'Peanut-free recipe' },
    { text: 'Made without milk' },
    { text: 'Free from egg' },
    { text: 'Dairy-free spread; may contain milk and hazelnuts.' },
    { text: 'Maltodextrin' },
    { text: 'Eggplant purée' },
    { text: 'Oyster mushrooms' },
  ])('finds no allergen source in "$text"', ({ text }) => {
    expect(sources(text)).toEqual([]);
  });

  it('keeps precautionary clauses apart from the composition', () => {
    const scan = scanComposition(
      'Sugar, cocoa butter. May contain traces of milk, peanuts; produced in a factory that handles sesame.',
      lexicon,
    );
    expect(scan.allergens).toEqual([]);
    expect(scan.precautionary.map((h) => h.source)).toEqual(['milk', 'peanut', 'sesame']);
  });

  it('keeps the species of fish and crustaceans it names', () => {
    const hits = scanComposition('Anchovy paste, shrimp', lexicon).allergens;
    expect(hits.map((h) => [h.source, h.species])).toEqual([
      ['fish', 'anchovy'],
      ['crustacean', 'shrimp'],
    ]);
  });

  it('reports the text as written', () => {
    expect(scanComposition('Sugar, WHEY powder', lexicon).allergens[0]).toMatchObject({ term: 'whey', matched: 'WHEY' });
  });

  // Animal-derived ingredients: common practice of vegan and vegetarian certification (from memory).
  it.each([
    { text: 'Beef gelatine', fails: ['vegan', 'vegetarian'], unverified: [] },
    { text: 'Colour: carmine', fails: ['vegan', 'vegetarian'], unverified: [] },
    { text: 'Glazing agent: shellac', fails: ['vegan'], unverified: [] },
    { text: 'Beeswax', fails: ['vegan'], unverified: [] },
    { text: 'Honey', fails: ['vegan'], unverified: [] },
    { text: 'Isinglass', fails: ['vegan', 'vegetarian'], unverified: [] },
    { text: 'Vitamin D3 (from lanolin)', fails: ['vegan'], unverified: ['vegan'] },
    { text: 'Cochineal', fails: ['vegan', 'vegetarian'], unverified: [] },
    { text: 'Microbial rennet', fails: [], unverified: [] },
  ])('"$text" fails $fails', ({ text, fails, unverified }) => {
    const animal = scanComposition(text, lexicon).animal;
    expect([...new Set(animal.flatMap((h) => h.fails))].sort()).toEqual(fails);
    expect([...new Set(animal.flatMap((h) => h.unverified))].sort()).toEqual(unverified);
  });

  it.each([
    { text: 'Mixed nuts', vague: 1 },
    { text: 'Pine nuts', vague: 0 },
    { text: 'Brazil nuts', vague: 0 },
    { text: 'Nutmeg', vague: 0 },
    { text: 'Coconut', vague: 0 },
  ])('"$text" names nuts vaguely $vague time(s)', ({ text, vague }) => {
    expect(scanComposition(text, lexicon).vague).toHaveLength(vague);
  });
});
