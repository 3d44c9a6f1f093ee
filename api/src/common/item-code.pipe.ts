import type { PipeTransform } from '@nestjs/common';
import { itemIdSchema } from '@crumbproof/shared';
import { AppError } from './app-error';

/**
 * The :code of an address: an ingredient's or recipe's id, written the one canonical way. Any
 * other spelling is refused with 400 saying how to write it, before anything is looked up.
 */
export class ItemCodePipe implements PipeTransform<string, string> {
  transform(value: string): string {
    const result = itemIdSchema.safeParse(value);
    if (result.success) return result.data;
    const message = result.error.issues[0].message;
    const shown = value.length > 80 ? `${value.slice(0, 80)}…` : value;
    throw new AppError('validation', `The address names '${shown}', which is not an id. ${message}`, [{ path: 'code', message }]);
  }
}
