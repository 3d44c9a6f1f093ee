import { Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import type { OutboxMail, OutboxPage } from '@crumbproof/shared';
import { Roles } from '../common/roles.decorator';
import { MailService } from './mail.service';

@ApiTags('mail')
@Controller('mail')
@Roles(['manager'])
export class MailController {
  constructor(private readonly mail: MailService) {}

  @Get('outbox')
  @ApiOperation({ summary: 'The outbox, newest first: each mail’s state, attempts, last error and recipients (manager)' })
  outbox(): Promise<OutboxPage> {
    return this.mail.page();
  }

  @Post('outbox/:id/retry')
  @HttpCode(200)
  @ApiOperation({ summary: 'Send again a mail that was not sent after its last attempt (manager)' })
  retry(@Param('id') id: string): Promise<OutboxMail> {
    return this.mail.retry(id);
  }
}
