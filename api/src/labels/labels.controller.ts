import { Body, Controller, Get, Header, HttpCode, Param, Post, Put, Query, Res } from '@nestjs/common';
import { ApiOperation, ApiQuery, ApiTags } from '@nestjs/swagger';
import type { FastifyReply } from 'fastify';
import {
  KITCHEN_WRITERS,
  labelRunRequestSchema,
  labelSettingsSaveSchema,
  staleHandledSchema,
  type LabelRunRequest,
  type LabelSettings,
  type StaleHandledRequest,
} from '@crumbproof/shared';
import { CurrentUser, type AuthUser } from '../common/current-user.decorator';
import { Roles } from '../common/roles.decorator';
import { withTotalCount } from '../common/total-count';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { labelRunQuerySchema, type LabelRunQuery } from './label-run-query';
import { LabelsService } from './labels.service';
import { StaleLabelsService } from './stale-labels.service';

/** Label templates, the kitchen's label settings, print runs and the print log. Front of house reads nothing here. */
@ApiTags('labels')
@Controller('labels')
@Roles(KITCHEN_WRITERS)
export class LabelsController {
  constructor(
    private readonly labels: LabelsService,
    private readonly stale: StaleLabelsService,
  ) {}

  @Get('templates')
  @ApiOperation({ summary: 'The label templates this installation prints (from label-templates/)' })
  templates() {
    return this.labels.templates();
  }

  @Get('settings')
  @ApiOperation({ summary: 'The kitchen’s label settings: batch code pattern, GS1 company prefix, SSCC extension digit, case indicator' })
  settings() {
    return this.labels.settings();
  }

  @Put('settings')
  @Roles(['manager'])
  @ApiOperation({ summary: 'Change the kitchen’s label settings (manager)' })
  @ApiZodBody(labelSettingsSaveSchema, 'Every setting, as PUT replaces them all')
  saveSettings(@Body(new ZodPipe(labelSettingsSaveSchema)) body: LabelSettings) {
    return this.labels.saveSettings(body);
  }

  @Post('runs')
  @HttpCode(201)
  @ApiOperation({
    summary:
      'Print a run: each product from its current declaration, with batch codes, dates and SSCC serials given out, logged with its PDF (an override with a reason is a manager’s)',
  })
  @ApiZodBody(labelRunRequestSchema)
  print(@CurrentUser() user: AuthUser, @Body(new ZodPipe(labelRunRequestSchema)) body: LabelRunRequest) {
    return this.labels.print(body, user);
  }

  @Get('runs')
  @ApiOperation({
    summary:
      'The print log, newest first; product, batch, from and to (production days) narrow it, limit and offset page it (X-Total-Count)',
  })
  @ApiQuery({ name: 'product', required: false, description: "A product's id: runs that printed it" })
  @ApiQuery({ name: 'batch', required: false, description: 'A batch code, exactly: runs that printed it (a recall)' })
  @ApiQuery({ name: 'from', required: false, format: 'date', description: 'First production day, YYYY-MM-DD' })
  @ApiQuery({ name: 'to', required: false, format: 'date', description: 'Last production day, YYYY-MM-DD' })
  @ApiQuery({ name: 'limit', required: false, type: Number, description: '1 to 500, 100 when left out' })
  @ApiQuery({ name: 'offset', required: false, type: Number })
  async runs(@Query(new ZodPipe(labelRunQuerySchema)) query: LabelRunQuery, @Res({ passthrough: true }) reply: FastifyReply) {
    return withTotalCount(reply, await this.labels.runs(query));
  }

  @Get('runs/:id/pdf')
  @Header('X-Content-Type-Options', 'nosniff')
  @Header('Content-Security-Policy', 'sandbox')
  @Header('Cache-Control', 'private, no-store')
  @ApiOperation({ summary: 'The PDF of a run exactly as printed, to download (sandboxed)' })
  pdf(@Param('id') id: string) {
    return this.labels.pdf(id);
  }

  @Get('stale')
  @ApiOperation({
    summary:
      'Printed labels and charts out of date: the product’s latest approval is newer than the print and differs from it; each says what to do, in words',
  })
  staleLabels() {
    return this.stale.list();
  }

  @Post('stale/:id/handled')
  @Roles(['manager'])
  @HttpCode(200)
  @ApiOperation({ summary: 'Mark out-of-date labels of a printed item (run-position) handled, with what was done (manager)' })
  @ApiZodBody(staleHandledSchema)
  markHandled(@CurrentUser() user: AuthUser, @Param('id') id: string, @Body(new ZodPipe(staleHandledSchema)) body: StaleHandledRequest) {
    return this.stale.markHandled(id, body, user);
  }
}
