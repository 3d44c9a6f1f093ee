import { REGIMES, type Regime } from '@crumbproof/shared';
import { useKitchen } from '@/api/kitchen';

export function isRegime(value: string | null | undefined): value is Regime {
  return typeof value === 'string' && (REGIMES as readonly string[]).includes(value);
}

/**
 * The kitchen's regime (undefined if it cannot be read: the API then uses the kitchen's own),
 * and whether it is still loading, so a page can wait rather than ask twice.
 */
export function useKitchenRegime(): { regime: Regime | undefined; isPending: boolean } {
  const kitchen = useKitchen();
  const regime = kitchen.data?.regime;
  return { regime: isRegime(regime) ? regime : undefined, isPending: kitchen.isPending };
}
