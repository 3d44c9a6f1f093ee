import { Controller, Get, Header, HttpCode, Param, Post, Req } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import type { FastifyRequest } from 'fastify';
import { KITCHEN_WRITERS } from '@crumbproof/shared';
import { CurrentUser, type AuthUser } from '../../common/current-user.decorator';
import { ItemCodePipe } from '../../common/item-code.pipe';
import { Roles } from '../../common/roles.decorator';
import { ApiUpload, readUpload } from '../../common/multipart-upload';
import { SpecificationsService } from './specifications.service';

@ApiTags('specifications')
@Controller()
@Roles(KITCHEN_WRITERS)
export class SpecificationsController {
  constructor(private readonly specs: SpecificationsService) {}

  @Post('ingredients/:code/specifications')
  @HttpCode(201)
  @ApiOperation({ summary: "Attach a new version of an ingredient's supplier specification (PDF, PNG, JPEG or WebP, at most 10 MB)" })
  @ApiUpload({
    reviewBy: {
      description: 'YYYY-MM-DD, today or later: when the kitchen must check it again; left out, one year from today',
      format: 'date',
    },
    note: { description: 'Optional, at most 500 characters' },
  })
  async upload(@CurrentUser() user: AuthUser, @Param('code', ItemCodePipe) code: string, @Req() req: FastifyRequest) {
    return this.specs.upload(code, await readUpload(req, ['reviewBy', 'note']), user.id);
  }

  @Get('ingredients/:code/specifications')
  @ApiOperation({ summary: "Every version of an ingredient's specification, newest first (metadata only)" })
  list(@Param('code') code: string) {
    return this.specs.list(code);
  }

  @Get('specifications/status')
  @ApiOperation({ summary: 'For every ingredient: its newest specification and whether it is missing, overdue or current' })
  status() {
    return this.specs.status();
  }

  @Get('specifications/reviews-due')
  @ApiOperation({
    summary:
      "The specifications to review, counted from the kitchen's date today: overdue ones (review-by date passed) and those due within 30 days",
  })
  reviewsDue() {
    return this.specs.reviewsDue();
  }

  @Get('specifications/:id/file')
  @Header('X-Content-Type-Options', 'nosniff')
  @Header('Content-Security-Policy', 'sandbox')
  @Header('Cache-Control', 'private, no-store')
  @ApiOperation({
    summary: 'The specification file itself, to download: the type found at upload, a name ending in its extension, sandboxed',
  })
  file(@Param('id') id: string) {
    return this.specs.file(id);
  }
}
