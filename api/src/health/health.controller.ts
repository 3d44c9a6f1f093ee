import { Controller, Get } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { Public } from '../common/roles.decorator';

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(private readonly sequelize: Sequelize) {}

  @Get()
  @Public()
  @ApiOperation({ summary: 'Is the API up and can it reach its database?' })
  async health() {
    await this.sequelize.query('SELECT 1 AS ok', { type: QueryTypes.SELECT });
    return { status: 'ok' };
  }
}
