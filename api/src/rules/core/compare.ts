/**
 * Legal thresholds are compared at six significant figures, through one helper kept in shared
 * (shared/src/round.ts) so that the rules core and the label renderer (a label's minimum
 * x-height) compare the same way.
 */
export { atThresholdPrecision, compare, round, THRESHOLD_SIGNIFICANT_FIGURES } from '@crumbproof/shared';
