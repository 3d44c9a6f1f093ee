import { Body, Controller, Get, HttpCode, Post, Query } from '@nestjs/common';
import { ApiOperation, ApiQuery, ApiTags } from '@nestjs/swagger';
import { bookRecipeSchema, REGIMES, ROLES, KITCHEN_WRITERS, type Regime } from '@crumbproof/shared';
import { Roles } from '../common/roles.decorator';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { DeclarationsService } from './declarations.service';
import { regimeQuery } from './regime-query';

/** Declarations of every product, and of a recipe as edited. One product's is GET /api/recipes/:code/declaration (RecipesController). */
@ApiTags('declarations')
@Controller('declarations')
export class DeclarationsController {
  constructor(private readonly declarations: DeclarationsService) {}

  @Get()
  @Roles(ROLES)
  @ApiOperation({ summary: 'Declarations of every product for sale' })
  @ApiQuery({ name: 'regime', required: false, enum: REGIMES })
  all(@Query('regime', new ZodPipe(regimeQuery)) regime?: Regime) {
    return this.declarations.all(regime);
  }

  @Post('preview')
  @HttpCode(200)
  @Roles(KITCHEN_WRITERS)
  @ApiOperation({ summary: 'Declare a recipe as edited, without saving it' })
  @ApiZodBody(bookRecipeSchema)
  @ApiQuery({ name: 'regime', required: false, enum: REGIMES })
  preview(@Body() body: unknown, @Query('regime', new ZodPipe(regimeQuery)) regime?: Regime) {
    return this.declarations.preview(body, regime);
  }
}
