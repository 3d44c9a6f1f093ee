import { Body, Controller, Get, HttpCode, Post } from '@nestjs/common';
import { RouteConfig } from '@nestjs/platform-fastify';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { bookFileSchema, type KitchenMakes } from '@crumbproof/shared';
import { MAX_BOOK_BYTES, type BodyLimitConfig } from '../common/limits';
import { CurrentUser, type AuthUser } from '../common/current-user.decorator';
import { Roles } from '../common/roles.decorator';
import { ApiZodBody } from '../common/zod.pipe';
import { BooksService } from './books.service';

@ApiTags('recipe book')
@Controller('book')
export class BooksController {
  constructor(private readonly books: BooksService) {}

  @Get()
  @Roles(['manager', 'pastry-chef'])
  @ApiOperation({ summary: 'Export the whole kitchen as a recipe book (also the backup format)' })
  export() {
    return this.books.exportBook();
  }

  @Get('kitchen')
  @Roles(['manager', 'pastry-chef'])
  @ApiOperation({
    summary:
      'What the request’s kitchen makes differently from the shared book: its own ingredients standing in by substitution, and the products it sells',
  })
  kitchenMakes(): Promise<KitchenMakes> {
    return this.books.kitchenMakes();
  }

  @Post('import')
  @HttpCode(200)
  @Roles(['manager'])
  @RouteConfig({ bodyLimit: MAX_BOOK_BYTES } satisfies BodyLimitConfig)
  @ApiOperation({ summary: 'Import a recipe book of one kitchen (site, or sites with one site), merging by id; all or nothing' })
  @ApiZodBody(bookFileSchema)
  import(@CurrentUser() user: AuthUser, @Body() body: unknown) {
    return this.books.importBook(body, { authorId: user.id, note: 'Imported from a recipe book' });
  }
}
