import { ArgumentsHost, Catch, ExceptionFilter, HttpException, Inject, Logger, NotFoundException, Optional } from '@nestjs/common';
import type { FastifyReply, FastifyRequest } from 'fastify';
import type { ApiErrorBody, ErrorCode } from '@crumbproof/shared';
import { DATABASE_LOST, DATABASE_UNAVAILABLE_MESSAGE, isDatabaseUnavailable, type DatabaseLostListener } from './database-unavailable';
import { AppError, httpStatusOf } from './app-error';
import { isRefusedAccess, REFUSAL_LISTENER, type RefusalListener } from './refusals';

/**
 * An error for the log: its message and its stack. A statement's error from Sequelize carries the
 * stack of where the query was made, which does not hold the message.
 */
function described(error: Error): string {
  const stack = error.stack ?? '';
  return stack.includes(error.message) ? stack : `${error.name}: ${error.message}\n${stack}`;
}

/**
 * Turns every error into an ApiErrorBody; a database that cannot be reached is a 503
 * (database-unavailable) in words, and other unknown errors become a logged 500 with a plain message.
 */
@Catch()
export class ApiExceptionFilter implements ExceptionFilter {
  private readonly logger = new Logger('Errors');
  /** The web app's index.html when the API also serves the web build (see app.factory.ts). */
  static webFallbackHtml: string | null = null;

  constructor(
    @Optional() @Inject(REFUSAL_LISTENER) private readonly refusals?: RefusalListener,
    @Optional() @Inject(DATABASE_LOST) private readonly databaseLost?: DatabaseLostListener,
  ) {}

  catch(exception: unknown, host: ArgumentsHost) {
    const reply = host.switchToHttp().getResponse<FastifyReply>();
    const request = host.switchToHttp().getRequest<FastifyRequest>();
    if (
      ApiExceptionFilter.webFallbackHtml &&
      exception instanceof NotFoundException &&
      request.method === 'GET' &&
      !request.url.startsWith('/api')
    ) {
      void reply.status(200).type('text/html; charset=utf-8').send(ApiExceptionFilter.webFallbackHtml);
      return;
    }
    const body = this.toBody(exception);
    if (this.refusals && isRefusedAccess(request, body)) {
      // The refusal is recorded before it is sent; a failure to record is logged by the listener.
      void this.refusals.refused(request, body).finally(() => void reply.status(body.statusCode).send(body));
      return;
    }
    void reply.status(body.statusCode).send(body);
  }

  private toBody(exception: unknown): ApiErrorBody {
    if (exception instanceof AppError) {
      return {
        statusCode: httpStatusOf(exception.code),
        code: exception.code,
        message: exception.message,
        ...(exception.fields ? { fields: exception.fields } : {}),
        ...(exception.problems ? { problems: exception.problems } : {}),
        ...(exception.stale?.stale ? { stale: exception.stale.stale } : {}),
        ...(exception.stale?.staleRows ? { staleRows: exception.stale.staleRows } : {}),
      };
    }
    if (exception instanceof HttpException) {
      const status = exception.getStatus();
      const code: ErrorCode =
        status === 401
          ? 'unauthenticated'
          : status === 403
            ? 'forbidden'
            : status === 404
              ? 'not-found'
              : status === 413
                ? 'too-large'
                : status === 429
                  ? 'too-many-requests'
                  : status >= 500
                    ? 'internal'
                    : 'validation';
      const message =
        status === 404
          ? 'There is nothing at this address.'
          : status === 401
            ? 'Sign in to continue.'
            : status === 403
              ? 'Your role cannot do this.'
              : status === 429
                ? 'Too many attempts. Wait a minute, then try again.'
                : exception.message;
      return { statusCode: status, code, message };
    }
    const fastifyStatus = (exception as { statusCode?: number })?.statusCode;
    if (typeof fastifyStatus === 'number' && fastifyStatus >= 400 && fastifyStatus < 500) {
      // Errors raised by Fastify itself (malformed JSON, body too large, wrong content type).
      const message = fastifyStatus === 413 ? 'The upload is too large.' : 'The request could not be read: send valid JSON.';
      return { statusCode: fastifyStatus, code: fastifyStatus === 413 ? 'too-large' : 'validation', message };
    }
    if (isDatabaseUnavailable(exception)) {
      // One line, no stack: every request says the same while the database is away.
      this.logger.warn(`The database cannot be reached: ${exception instanceof Error ? exception.message : String(exception)}`);
      // Nor can a revocation be heard: nothing is served from memory until the database answers again.
      this.databaseLost?.lost();
      return { statusCode: 503, code: 'database-unavailable', message: DATABASE_UNAVAILABLE_MESSAGE };
    }
    this.logger.error(exception instanceof Error ? described(exception) : String(exception));
    return { statusCode: 500, code: 'internal', message: 'Something went wrong on the server. It has been logged; try again.' };
  }
}
