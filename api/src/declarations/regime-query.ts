import { REGIMES } from '@crumbproof/shared';
import { z } from 'zod';

/** `?regime=` of the declaration routes: one of the regimes, or left out for the kitchen's own. */
export const regimeQuery = z.enum(REGIMES, { message: `Use one of ${REGIMES.join(', ')}.` }).optional();
