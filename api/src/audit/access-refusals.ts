import { Injectable } from '@nestjs/common';
import type { FastifyRequest } from 'fastify';
import type { ApiErrorBody } from '@crumbproof/shared';
import type { AuthUser } from '../common/current-user.decorator';
import type { RefusalListener } from '../common/refusals';
import { AuditService } from './audit.service';

/** Records each refused access (a role that may not, an ended session) in the audit trail, outside any transaction. */
@Injectable()
export class AccessRefusals implements RefusalListener {
  constructor(private readonly audit: AuditService) {}

  async refused(request: FastifyRequest, body: ApiErrorBody): Promise<void> {
    const user = (request as FastifyRequest & { user?: AuthUser }).user;
    const path = (request.url ?? '').split('?')[0].slice(0, 200);
    await this.audit.recordRefusal({
      action: 'access.refused',
      actor: user ? { id: user.id, name: user.name, role: user.role } : null,
      address: request.ip ?? null,
      record: { kind: 'route', id: `${request.method} ${path}`.slice(0, 120) },
      summary: `${body.statusCode} ${request.method} ${path}: ${body.message}`,
    });
  }
}
