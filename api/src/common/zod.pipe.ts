import type { ArgumentMetadata, PipeTransform } from '@nestjs/common';
import { ApiBody } from '@nestjs/swagger';
import { bodyPlace, formatIssue, issueField, type ErrorCode, type IssuePlace } from '@crumbproof/shared';
import { z } from 'zod';
import { AppError } from './app-error';

/** Validates a request part against a shared zod contract; every bad field is named. */
export class ZodPipe<S extends z.ZodType> implements PipeTransform<unknown, z.infer<S>> {
  constructor(private readonly schema: S) {}

  transform(value: unknown, metadata?: ArgumentMetadata): z.infer<S> {
    const result = this.schema.safeParse(value);
    if (result.success) return result.data;
    throw validationError(result.error, { place: placeOf(metadata) });
  }
}

/**
 * Where a bad value was sent: a body's dotted paths; a query or path parameter by its name
 * ("regime"), with the query's own names when the whole query is checked.
 */
function placeOf(metadata?: ArgumentMetadata): IssuePlace {
  if (!metadata || metadata.type === 'body' || metadata.type === 'custom') return bodyPlace;
  const whole = metadata.type === 'query' ? '(query)' : '(address)';
  return (path) => [metadata.data, ...path.map(String)].filter((x) => x !== undefined && x !== '').join('.') || whole;
}

/**
 * Every issue of a failed parse as a field of the error, named by `place` (a request body's
 * dotted paths unless told otherwise), and all of them in the message after `lead`.
 */
export function validationError(
  error: z.ZodError,
  {
    place = bodyPlace,
    code = 'validation',
    lead = 'Some fields need attention.',
  }: { place?: IssuePlace; code?: ErrorCode; lead?: string } = {},
): AppError {
  const fields = error.issues.map((issue) => issueField(issue, place));
  const summary = error.issues.map((issue) => formatIssue(issue, place)).join(' ');
  return new AppError(code, `${lead} ${summary}`, fields);
}

/** Documents a zod-validated body in the OpenAPI document. */
export function ApiZodBody(schema: z.ZodType, description?: string) {
  return ApiBody({ description, schema: z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as object });
}
