import { Body, Controller, Get, HttpCode, Param, Post, Put, Query, Req, Res } from '@nestjs/common';
import { ApiOperation, ApiQuery, ApiTags } from '@nestjs/swagger';
import type { FastifyReply, FastifyRequest } from 'fastify';
import {
  bookRecipeSchema,
  recipeSaveSchema,
  KITCHEN_WRITERS,
  REGIMES,
  ROLES,
  type BookRecipe,
  type RecipeSave,
  type Regime,
} from '@crumbproof/shared';
import { CurrentUser, type AuthUser } from '../common/current-user.decorator';
import { ItemCodePipe } from '../common/item-code.pipe';
import { sendPrepared } from '../common/prepared-json';
import { Roles } from '../common/roles.decorator';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { regimeQuery } from '../declarations/regime-query';
import { RecipesService } from './recipes.service';

@ApiTags('recipes')
@Controller('recipes')
export class RecipesController {
  constructor(private readonly recipes: RecipesService) {}

  @Get()
  @Roles(ROLES)
  @ApiOperation({ summary: 'Every recipe and product with its current revision' })
  list() {
    return this.recipes.list();
  }

  @Get(':code')
  @Roles(ROLES)
  @ApiOperation({ summary: 'One recipe, current revision' })
  get(@Param('code') code: string) {
    return this.recipes.get(code);
  }

  @Get(':code/declaration')
  @Roles(ROLES)
  @ApiTags('declarations')
  @ApiOperation({ summary: 'A product’s declaration for a regime (the kitchen’s by default)' })
  @ApiQuery({ name: 'regime', required: false, enum: REGIMES })
  async declaration(
    @Req() request: FastifyRequest,
    @Res() reply: FastifyReply,
    @Param('code') code: string,
    @Query('regime', new ZodPipe(regimeQuery)) regime?: Regime,
  ) {
    // Sent as serialised once for this state of the kitchen, with its entity tag (If-None-Match: 304).
    return sendPrepared(request, reply, await this.recipes.declaration(code, regime));
  }

  @Get(':code/revisions')
  @Roles(KITCHEN_WRITERS)
  @ApiOperation({ summary: 'Every revision of a recipe, newest first' })
  history(@Param('code') code: string) {
    return this.recipes.history(code);
  }

  @Get(':code/used-in')
  @Roles(KITCHEN_WRITERS)
  @ApiOperation({ summary: 'Every recipe and product that uses this recipe at any depth' })
  usedIn(@Param('code') code: string) {
    return this.recipes.usedIn(code);
  }

  @Post()
  @Roles(KITCHEN_WRITERS)
  @HttpCode(201)
  @ApiOperation({ summary: 'Add a recipe or product; refused if it cannot be declared' })
  @ApiZodBody(bookRecipeSchema)
  create(@CurrentUser() user: AuthUser, @Body(new ZodPipe(bookRecipeSchema)) body: BookRecipe) {
    return this.recipes.create(body, user.id);
  }

  @Put(':code')
  @Roles(KITCHEN_WRITERS)
  @ApiOperation({ summary: 'Save a recipe as a new revision; refused if it cannot be declared' })
  @ApiZodBody(recipeSaveSchema, 'The recipe with baseRevision, the revision the editor started from')
  update(@CurrentUser() user: AuthUser, @Param('code', ItemCodePipe) code: string, @Body(new ZodPipe(recipeSaveSchema)) body: RecipeSave) {
    return this.recipes.update(code, body, user.id);
  }
}
