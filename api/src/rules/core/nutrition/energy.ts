/**
 * Energy from nutrients.
 *
 * EU/UK: Regulation (EU) No 1169/2011, Annex XIV conversion factors. kJ and kcal are each
 * computed from their own factors (they are not in a 4.184 ratio), never by converting one
 * into the other and never from a supplier's stated energy.
 *
 * Conventions of the book's figures (Annex I definitions):
 * - `carbohydrate` includes polyols, so the carbohydrate factor applies to carbohydrate − polyols;
 * - `polyols` includes erythritol (a polyol), which takes the 0 factor instead of the polyol one;
 * - `fat` includes salatrims (they are lipids), which take their own factor instead of fat's;
 * - fibre, alcohol and organic acids stand apart from the other figures.
 */

export interface EnergyInputs {
  fat: number;
  salatrims: number;
  carbohydrate: number;
  polyols: number;
  erythritol: number;
  fibre: number;
  protein: number;
  alcohol: number;
  organicAcids: number;
}

export interface Factor {
  kj: number;
  kcal: number;
}

/** Annex XIV, Reg 1169/2011. */
export const EU_ENERGY_FACTORS = {
  carbohydrateExceptPolyols: { kj: 17, kcal: 4 },
  polyolsExceptErythritol: { kj: 10, kcal: 2.4 },
  erythritol: { kj: 0, kcal: 0 },
  protein: { kj: 17, kcal: 4 },
  fatExceptSalatrims: { kj: 37, kcal: 9 },
  salatrims: { kj: 25, kcal: 6 },
  alcohol: { kj: 29, kcal: 7 },
  organicAcids: { kj: 13, kcal: 3 },
  fibre: { kj: 8, kcal: 2 },
} as const satisfies Record<string, Factor>;

export type EnergyComponent = keyof typeof EU_ENERGY_FACTORS;

/** Relative slack for sums of consistent ingredients that differ only by floating-point error. */
const SLACK = 1e-9;

/** Throws when `part` ("of which") exceeds `whole` beyond floating-point error. */
export function checkPart(part: number, whole: number, what: string): void {
  if (part > whole + SLACK * Math.max(1, whole)) {
    throw new Error(`${what}: ${part} g is more than the ${whole} g it is part of.`);
  }
}

/** Splits the figures into the Annex XIV components; throws when they contradict each other. */
export function energyComponents(n: EnergyInputs): Record<EnergyComponent, number> {
  checkPart(n.erythritol, n.polyols, 'Erythritol within polyols');
  checkPart(n.polyols, n.carbohydrate, 'Polyols within carbohydrate');
  checkPart(n.salatrims, n.fat, 'Salatrims within fat');
  return {
    carbohydrateExceptPolyols: Math.max(0, n.carbohydrate - n.polyols),
    polyolsExceptErythritol: Math.max(0, n.polyols - n.erythritol),
    erythritol: n.erythritol,
    protein: n.protein,
    fatExceptSalatrims: Math.max(0, n.fat - n.salatrims),
    salatrims: n.salatrims,
    alcohol: n.alcohol,
    organicAcids: n.organicAcids,
    fibre: n.fibre,
  };
}

/** EU energy, unrounded, in kJ and kcal. */
export function euEnergy(n: EnergyInputs): Factor {
  const parts = energyComponents(n);
  let kj = 0;
  let kcal = 0;
  for (const key of Object.keys(EU_ENERGY_FACTORS) as EnergyComponent[]) {
    kj += parts[key] * EU_ENERGY_FACTORS[key].kj;
    kcal += parts[key] * EU_ENERGY_FACTORS[key].kcal;
  }
  return { kj, kcal };
}

export interface UsCalorieInputs {
  fat: number;
  /** US total carbohydrate (book carbohydrate + fibre; includes sugar alcohols). */
  totalCarbohydrate: number;
  protein: number;
  alcohol: number;
}

/**
 * US calories, unrounded: the general factors of 21 CFR 101.9(c)(1)(i) (from memory):
 * 4 kcal/g protein, 4 kcal/g total carbohydrate, 9 kcal/g fat. Total carbohydrate here
 * includes dietary fibre and sugar alcohols (polyols, erythritol), all at 4 kcal/g: the
 * general-factor method, which does not subtract non-digestible carbohydrate, so it never
 * understates. Salatrims are counted with fat at 9 kcal/g. Ethanol, which the three factors
 * do not cover, is added at 7 kcal/g (Atwater's general factor, from memory). Organic acids
 * are not counted (the book's carbohydrate excludes them).
 */
export const US_CALORIE_FACTORS = { fat: 9, totalCarbohydrate: 4, protein: 4, alcohol: 7 } as const;

export function usCalories(n: UsCalorieInputs): number {
  return (
    n.fat * US_CALORIE_FACTORS.fat +
    n.totalCarbohydrate * US_CALORIE_FACTORS.totalCarbohydrate +
    n.protein * US_CALORIE_FACTORS.protein +
    n.alcohol * US_CALORIE_FACTORS.alcohol
  );
}

/** Annex I point 11, Reg 1169/2011: salt = sodium × 2.5. */
export const SALT_PER_SODIUM = 2.5;
