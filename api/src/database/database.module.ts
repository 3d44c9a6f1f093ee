import { Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { SequelizeModule } from '@nestjs/sequelize';
import type { AppConfig } from '../config/config';
import { ChangeFeedModule } from './change-feed';
import { connectionOptions } from './connection';

/**
 * The API's connection, as its runtime user (DB_USER); migrations run as the owner (schema-setup.ts).
 * With it, the feed that tells every copy kept in memory when it no longer stands (ChangeFeed).
 */
@Module({
  imports: [
    SequelizeModule.forRootAsync({
      inject: [ConfigService],
      useFactory: (config: ConfigService<AppConfig, true>) => ({
        ...connectionOptions({
          DB_HOST: config.get('DB_HOST', { infer: true }),
          DB_PORT: config.get('DB_PORT', { infer: true }),
          DB_NAME: config.get('DB_NAME', { infer: true }),
          DB_USER: config.get('DB_USER', { infer: true }),
          DB_PASSWORD: config.get('DB_PASSWORD', { infer: true }),
          DB_OWNER_USER: undefined,
          DB_OWNER_PASSWORD: undefined,
        }),
        dialect: 'mariadb' as const,
        autoLoadModels: true,
        synchronize: false,
      }),
    }),
    ChangeFeedModule,
  ],
})
export class DatabaseModule {}
