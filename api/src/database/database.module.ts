import { Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { SequelizeModule } from '@nestjs/sequelize';
import type { AppConfig } from '../config/config';

@Module({
  imports: [
    SequelizeModule.forRootAsync({
      inject: [ConfigService],
      useFactory: (config: ConfigService<AppConfig, true>) => ({
        dialect: 'mariadb',
        host: config.get('DB_HOST', { infer: true }),
        port: config.get('DB_PORT', { infer: true }),
        database: config.get('DB_NAME', { infer: true }),
        username: config.get('DB_USER', { infer: true }),
        password: config.get('DB_PASSWORD', { infer: true }),
        autoLoadModels: true,
        synchronize: false,
        logging: false,
        define: { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci', underscored: true },
        timezone: '+00:00',
        dialectOptions: { connectTimeout: 5000 },
        pool: { max: 10, min: 0, idle: 10000 },
      }),
    }),
  ],
})
export class DatabaseModule {}
