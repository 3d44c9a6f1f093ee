import { Module } from '@nestjs/common';
import { BooksModule } from '../books/books.module';
import { RulesModule } from '../rules/rules.module';
import { SwapsController } from './swaps.controller';
import { SwapsService } from './swaps.service';

@Module({ imports: [BooksModule, RulesModule], controllers: [SwapsController], providers: [SwapsService] })
export class SwapsModule {}
