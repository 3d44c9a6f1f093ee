import { z } from 'zod';

export const swapRequestSchema = z.strictObject({
  from: z.string().trim().min(1, 'Choose the ingredient to replace.'),
  to: z.string().trim().min(1, 'Choose the replacement.'),
  /** One recipe; left out, every recipe that uses `from` directly. */
  recipe: z.string().trim().min(1).optional(),
});
export type SwapRequest = z.infer<typeof swapRequestSchema>;
