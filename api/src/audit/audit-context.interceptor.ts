import { Injectable, type CallHandler, type ExecutionContext, type NestInterceptor } from '@nestjs/common';
import type { FastifyRequest } from 'fastify';
import { Observable } from 'rxjs';
import type { AuthUser } from '../common/current-user.decorator';
import { runInRequest } from '../common/request-context';

/**
 * After the guards, holds who is asking (the session's user, or nobody on a public route), the
 * kitchen the request is for and the client's address for the whole handling of the request, so every write's audit event names them.
 */
@Injectable()
export class AuditContextInterceptor implements NestInterceptor {
  intercept(context: ExecutionContext, next: CallHandler): Observable<unknown> {
    if (context.getType() !== 'http') return next.handle();
    const request = context.switchToHttp().getRequest<FastifyRequest & { user?: AuthUser }>();
    const user = request.user;
    const store = {
      actor: user ? { id: user.id, name: user.name, role: user.role } : null,
      address: request.ip ?? null,
      kitchenId: user?.kitchenId ?? null,
    };
    return new Observable((subscriber) => runInRequest(store, () => next.handle().subscribe(subscriber)));
  }
}
