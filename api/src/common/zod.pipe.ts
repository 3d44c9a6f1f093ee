import { PipeTransform } from '@nestjs/common';
import { ApiBody } from '@nestjs/swagger';
import { z } from 'zod';
import { AppError } from './app-error';

/** Validates a request part against a shared zod contract; every bad field is named. */
export class ZodPipe<S extends z.ZodType> implements PipeTransform<unknown, z.infer<S>> {
  constructor(private readonly schema: S) {}

  transform(value: unknown): z.infer<S> {
    const result = this.schema.safeParse(value);
    if (result.success) return result.data;
    throw validationError(result.error);
  }
}

export function validationError(error: z.ZodError): AppError {
  const fields = error.issues.map((i) => ({ path: i.path.map(String).join('.') || '(body)', message: i.message }));
  const summary = fields.map((f) => `${f.path}: ${f.message}`).join(' ');
  return new AppError('validation', `Some fields need attention. ${summary}`, fields);
}

/** Documents a zod-validated body in the OpenAPI document. */
export function ApiZodBody(schema: z.ZodType, description?: string) {
  return ApiBody({ description, schema: z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as object });
}
