import type { BookIngredient } from '@crumbproof/shared';
import { ingredientFigures } from './ingredient-figures';

const base: BookIngredient = { id: 'x', name: 'X', vegan: null, vegetarian: null, mayContain: [] };
const core = { fat: 1, saturates: 0.5, carbohydrate: 20, sugars: 10, fibre: 1, protein: 2 };

describe('ingredientFigures', () => {
  it('gives nothing for an ingredient without nutrition (never zero)', () => {
    const f = ingredientFigures(base);
    expect(Object.values(f).every((v) => v === null)).toBe(true);
  });

  // Reg 1169/2011 Annex I pt 11: salt = sodium × 2.5, so sodium = salt ÷ 2.5.
  it.each([
    { n: { sodium: 0.4 }, salt: 1.0, sodium: 0.4 },
    { n: { salt: 1.5 }, salt: 1.5, sodium: 0.6 },
    { n: {}, salt: null, sodium: null },
  ])('salt and sodium from $n', ({ n, salt, sodium }) => {
    const f = ingredientFigures({ ...base, nutrition: { ...core, ...n } });
    if (salt === null) expect(f.salt).toBeNull();
    else expect(f.salt).toBeCloseTo(salt, 12);
    if (sodium === null) expect(f.sodium).toBeNull();
    else expect(f.sodium).toBeCloseTo(sodium, 12);
  });

  it.each([
    { what: 'flagged: all sugars', extra: { addsSugars: true }, n: {}, added: 10 },
    { what: 'flagged, stated figure wins', extra: { addsSugars: true }, n: { addedSugars: 4 }, added: 4 },
    { what: 'flagged as adding none', extra: { addsSugars: false }, n: {}, added: 0 },
    { what: 'not flagged and no sugars: none', extra: {}, n: { sugars: 0 }, added: 0 },
    { what: 'not flagged, with sugars: unknown, never zero', extra: {}, n: {}, added: null },
    { what: 'flagged but sugars unknown', extra: { addsSugars: true }, n: { sugars: undefined }, added: null },
  ])('added sugars, $what', ({ extra, n, added }) => {
    const f = ingredientFigures({ ...base, ...extra, nutrition: { ...core, ...n } });
    expect(f.addedSugars).toBe(added);
  });

  it('reads left-out polyols, erythritol, alcohol, organic acids and salatrims as none, other keys as unknown', () => {
    const f = ingredientFigures({ ...base, nutrition: core });
    expect([f.polyols, f.erythritol, f.alcohol, f.organicAcids, f.salatrims]).toEqual([0, 0, 0, 0, 0]);
    expect([f.transFat, f.cholesterolMg, f.salt]).toEqual([null, null, null]);
  });

  it('counts erythritol within polyols when polyols are left out', () => {
    const f = ingredientFigures({ ...base, nutrition: { ...core, erythritol: 5 } });
    expect(f.polyols).toBe(5);
    expect(f.erythritol).toBe(5);
  });

  it('refuses erythritol above polyols, naming the ingredient', () => {
    expect(() => ingredientFigures({ ...base, nutrition: { ...core, polyols: 2, erythritol: 5 } })).toThrow(/"X"/);
  });
});
