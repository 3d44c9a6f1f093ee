import { Module } from '@nestjs/common';
import { DatabaseProbeRepository } from './database-probe.repository';
import { HealthController } from './health.controller';

@Module({ controllers: [HealthController], providers: [DatabaseProbeRepository] })
export class HealthModule {}
