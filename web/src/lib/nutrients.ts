import { FIGURE_NAMES, type FigureKey } from '@crumbproof/shared';

export { FIGURE_NAMES };

/** "Energy (kJ)", "Fat": energy names its unit, since it comes in two. */
export function figureLabel(key: FigureKey): string {
  const { name, unit } = FIGURE_NAMES[key];
  return key === 'energyKj' || key === 'energyKcal' ? `${name} (${unit})` : name;
}
