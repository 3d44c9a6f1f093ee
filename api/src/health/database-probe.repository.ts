import { Injectable } from '@nestjs/common';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';

/** The one query of the health check: can the API reach its database? */
@Injectable()
export class DatabaseProbeRepository {
  constructor(private readonly sequelize: Sequelize) {}

  async ping(): Promise<void> {
    await this.sequelize.query('SELECT 1 AS ok', { type: QueryTypes.SELECT });
  }
}
