import { Controller, Get } from '@nestjs/common';
import { ApiOperation, ApiResponse, ApiTags } from '@nestjs/swagger';
import { Public } from '../common/roles.decorator';
import { DatabaseProbeRepository } from './database-probe.repository';

/** What GET /api/health answers while the database answers; otherwise a 503 ApiErrorBody (database-unavailable). */
export interface HealthStatus {
  status: 'ok';
  database: 'up';
}

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(private readonly database: DatabaseProbeRepository) {}

  @Get()
  @Public()
  @ApiOperation({ summary: 'Is the API up and can it reach its database?' })
  @ApiResponse({ status: 200, description: 'The API runs and its database answered.' })
  @ApiResponse({ status: 503, description: 'The API runs but its database did not answer within 2 s (code database-unavailable).' })
  async health(): Promise<HealthStatus> {
    await this.database.ping();
    return { status: 'ok', database: 'up' };
  }
}
