import { Controller, Get, Header, Param, Query } from '@nestjs/common';
import { ApiOperation, ApiQuery, ApiTags } from '@nestjs/swagger';
import { auditQuerySchema, recallQuerySchema, type AuditQuery, type RecallQuery } from '@crumbproof/shared';
import { Roles } from '../common/roles.decorator';
import { ZodPipe } from '../common/zod.pipe';
import { AuditTrailService } from './audit-trail.service';
import { RecallService } from './recall.service';

const FILTERS = [
  { name: 'user', type: Number, description: 'A user’s number: what they did' },
  { name: 'action', description: 'One action, e.g. recipe.saved' },
  { name: 'record', description: 'A record’s id exactly: an item’s code, a user’s number, a print run’s number' },
  { name: 'from', format: 'date', description: 'First day, YYYY-MM-DD' },
  { name: 'to', format: 'date', description: 'Last day, YYYY-MM-DD' },
  { name: 'sort', enum: ['newest', 'oldest'], description: 'By time; newest first when left out' },
] as const;
const ApiFilters = () => (target: object, key: string | symbol, descriptor: PropertyDescriptor) => {
  for (const f of FILTERS) ApiQuery({ required: false, ...f })(target, key, descriptor);
};

/** The audit trail and the recall from a batch code (manager). */
@ApiTags('audit')
@Controller('audit')
@Roles(['manager'])
export class AuditController {
  constructor(
    private readonly trail: AuditTrailService,
    private readonly recalls: RecallService,
  ) {}

  @Get()
  @ApiOperation({ summary: 'The audit trail, newest first: filtered by user, action, record and days, one page at a time with the total' })
  @ApiFilters()
  @ApiQuery({ name: 'page', required: false, type: Number, description: 'From 1' })
  @ApiQuery({ name: 'pageSize', required: false, type: Number, description: '1 to 200, 50 when left out' })
  page(@Query(new ZodPipe(auditQuerySchema)) query: AuditQuery) {
    return this.trail.page(query);
  }

  @Get('export.csv')
  @Header('Cache-Control', 'private, no-store')
  @Header('X-Content-Type-Options', 'nosniff')
  @ApiOperation({ summary: 'The audit trail with the same filters as CSV (RFC 4180, UTF-8 with a byte order mark), every matching event' })
  @ApiFilters()
  export(@Query(new ZodPipe(auditQuerySchema)) query: AuditQuery) {
    return this.trail.export({ ...query, page: undefined, pageSize: undefined });
  }

  @Get('recall')
  @ApiOperation({
    summary: 'Recall from a batch code: every print of it, the declaration each carried, and what has changed in the product since',
  })
  @ApiQuery({ name: 'batch', required: true, description: 'The batch code as printed' })
  recall(@Query(new ZodPipe(recallQuerySchema)) query: RecallQuery) {
    return this.recalls.fromBatch(query.batch);
  }

  @Get(':id')
  @ApiOperation({ summary: 'One audit event in full: the record before and after the write' })
  event(@Param('id') id: string) {
    return this.trail.event(id);
  }
}
