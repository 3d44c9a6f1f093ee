import { Controller, Get } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { Public } from '../common/roles.decorator';
import { DatabaseProbeRepository } from './database-probe.repository';

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(private readonly database: DatabaseProbeRepository) {}

  @Get()
  @Public()
  @ApiOperation({ summary: 'Is the API up and can it reach its database?' })
  async health() {
    await this.database.ping();
    return { status: 'ok' };
  }
}
