import { Module } from '@nestjs/common';
import { BooksModule } from '../books/books.module';
import { UsersModule } from '../users/users.module';
import { SeedService } from './seed.service';

@Module({ imports: [BooksModule, UsersModule], providers: [SeedService], exports: [SeedService] })
export class SeedModule {}
