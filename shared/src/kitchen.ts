import { z } from 'zod';
import { CONTROLS, MEASURE_SYSTEMS, REGIMES, allergenSourceSchema } from './allergens';
import { oneLine } from './text';

/** How the kitchen handles one allergen source: kept apart, or on shared equipment or in a shared area. */
export const handlingSchema = z.strictObject({ allergen: allergenSourceSchema, controls: z.enum(CONTROLS) });
export type Handling = z.infer<typeof handlingSchema>;

/** The kitchen (site) as the API sends it. */
export const kitchenSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  address: z.string(),
  regime: z.enum(REGIMES),
  measures: z.enum(MEASURE_SYSTEMS).nullable(),
  handles: z.array(handlingSchema),
});
export type KitchenView = z.infer<typeof kitchenSchema>;

/** What the manager may change; every product's declaration follows. */
export const kitchenUpdateSchema = z
  .strictObject({
    name: oneLine(z.string().trim().min(1, 'Give the kitchen a name.').max(160)).optional(),
    address: oneLine(z.string().trim().max(300)).optional(),
    regime: z.enum(REGIMES).optional(),
    /** null: follow the regime's usual household measures. */
    measures: z.enum(MEASURE_SYSTEMS).nullable().optional(),
    handles: z.array(handlingSchema).optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'Change at least one field.')
  .refine((v) => !v.handles || new Set(v.handles.map((h) => h.allergen)).size === v.handles.length, {
    message: 'List each allergen source once.',
    path: ['handles'],
  });
export type KitchenUpdate = z.infer<typeof kitchenUpdateSchema>;
