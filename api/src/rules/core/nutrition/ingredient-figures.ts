import type { BookIngredient, NutrientKey } from '@crumbproof/shared';
import { checkPart, SALT_PER_SODIUM } from './energy';

/** Per 100 g as eaten raw; null = the ingredient does not give the figure. */
export type IngredientFigures = Record<NutrientKey, number | null>;

/**
 * The nutrients of one ingredient per 100 g, with the derivations Crumbproof applies:
 * - salt = sodium × 2.5 (Reg 1169/2011 Annex I pt 11) when only sodium is given, and
 *   sodium = salt ÷ 2.5 when only salt is given;
 * - added sugars = `nutrition.addedSugars` when given; otherwise all its sugars when the
 *   ingredient is flagged `addsSugars: true` (unknown if its sugars are unknown), none when it is
 *   flagged `addsSugars: false` or has no sugars; an ingredient with sugars that says neither is
 *   unknown, so the US added-sugars figure stays incomplete until the kitchen says;
 * - polyols include erythritol: left out, they are at least the erythritol given;
 * - polyols, erythritol, alcohol, organic acids and salatrims are components a supplier states
 *   when present: an ingredient that has a nutrition statement and leaves one out contains none.
 *   Every other key left out is unknown (the figure becomes incomplete, never zero).
 * An ingredient without any nutrition gives no figure at all.
 */
export function ingredientFigures(ingredient: BookIngredient): IngredientFigures {
  const n = ingredient.nutrition;
  if (!n) {
    return {
      fat: null,
      saturates: null,
      transFat: null,
      cholesterolMg: null,
      carbohydrate: null,
      sugars: null,
      addedSugars: null,
      polyols: null,
      erythritol: null,
      fibre: null,
      protein: null,
      salt: null,
      sodium: null,
      alcohol: null,
      organicAcids: null,
      salatrims: null,
    };
  }
  const known = (v: number | undefined): number | null => (v === undefined ? null : v);
  const salt = n.salt !== undefined ? n.salt : n.sodium !== undefined ? n.sodium * SALT_PER_SODIUM : null;
  const sodium = n.sodium !== undefined ? n.sodium : n.salt !== undefined ? n.salt / SALT_PER_SODIUM : null;
  const addedSugars =
    n.addedSugars !== undefined
      ? n.addedSugars
      : ingredient.addsSugars === true
        ? known(n.sugars)
        : ingredient.addsSugars === false || n.sugars === 0
          ? 0
          : null;
  const erythritol = n.erythritol ?? 0;
  const polyols = n.polyols ?? erythritol;
  const salatrims = n.salatrims ?? 0;

  const where = `Ingredient "${ingredient.name}" (${ingredient.id})`;
  checkPart(erythritol, polyols, `${where}: erythritol within polyols`);
  if (n.carbohydrate !== undefined) checkPart(polyols, n.carbohydrate, `${where}: polyols within carbohydrate`);
  if (n.fat !== undefined) checkPart(salatrims, n.fat, `${where}: salatrims within fat`);

  return {
    fat: known(n.fat),
    saturates: known(n.saturates),
    transFat: known(n.transFat),
    cholesterolMg: known(n.cholesterolMg),
    carbohydrate: known(n.carbohydrate),
    sugars: known(n.sugars),
    addedSugars,
    polyols,
    erythritol,
    fibre: known(n.fibre),
    protein: known(n.protein),
    salt,
    sodium,
    alcohol: n.alcohol ?? 0,
    organicAcids: n.organicAcids ?? 0,
    salatrims,
  };
}
