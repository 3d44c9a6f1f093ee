import type { FigureKey } from '@crumbproof/shared';

/**
 * The name and unit of every nutrition figure, as the screens write them: "Energy (kJ)" in the
 * nutrition table, "energy 1472 kJ" beside an ingredient's figures. Keys are the shared
 * FIGURE_KEYS, so a figure added there must be named here.
 */
export const FIGURE_NAMES: Record<FigureKey, { name: string; unit: 'kJ' | 'kcal' | 'g' | 'mg' }> = {
  energyKj: { name: 'Energy', unit: 'kJ' },
  energyKcal: { name: 'Energy', unit: 'kcal' },
  fat: { name: 'Fat', unit: 'g' },
  saturates: { name: 'Saturates', unit: 'g' },
  transFat: { name: 'Trans fat', unit: 'g' },
  cholesterolMg: { name: 'Cholesterol', unit: 'mg' },
  carbohydrate: { name: 'Carbohydrate', unit: 'g' },
  sugars: { name: 'Sugars', unit: 'g' },
  addedSugars: { name: 'Added sugars', unit: 'g' },
  polyols: { name: 'Polyols', unit: 'g' },
  erythritol: { name: 'Erythritol', unit: 'g' },
  fibre: { name: 'Fibre', unit: 'g' },
  protein: { name: 'Protein', unit: 'g' },
  salt: { name: 'Salt', unit: 'g' },
  sodium: { name: 'Sodium', unit: 'g' },
  alcohol: { name: 'Alcohol', unit: 'g' },
  organicAcids: { name: 'Organic acids', unit: 'g' },
  salatrims: { name: 'Salatrims', unit: 'g' },
};

/** "Energy (kJ)", "Fat": energy names its unit, since it comes in two. */
export function figureLabel(key: FigureKey): string {
  const { name, unit } = FIGURE_NAMES[key];
  return key === 'energyKj' || key === 'energyKcal' ? `${name} (${unit})` : name;
}
