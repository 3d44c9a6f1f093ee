import { Body, Controller, Get, HttpCode, Param, Post, Put, Query, Res } from '@nestjs/common';
import type { FastifyReply } from 'fastify';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { bookIngredientSchema, ingredientSaveSchema, KITCHEN_WRITERS, type BookIngredient, type IngredientSave } from '@crumbproof/shared';
import { CurrentUser, type AuthUser } from '../common/current-user.decorator';
import { ItemCodePipe } from '../common/item-code.pipe';
import { Roles } from '../common/roles.decorator';
import { withTotalCount } from '../common/total-count';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { IngredientsService, ingredientQuerySchema, type IngredientQuery } from './ingredients.service';

@ApiTags('ingredients')
@Controller('ingredients')
@Roles(KITCHEN_WRITERS)
export class IngredientsController {
  constructor(private readonly ingredients: IngredientsService) {}

  @Get()
  @ApiOperation({
    summary:
      'Ingredients with their current revision; q, source, sort, limit and offset narrow and page the list (the total is in X-Total-Count)',
  })
  async list(@Query(new ZodPipe(ingredientQuerySchema)) query: IngredientQuery, @Res({ passthrough: true }) reply: FastifyReply) {
    return withTotalCount(reply, await this.ingredients.list(query));
  }

  @Get(':code')
  @ApiOperation({ summary: 'One ingredient, current revision' })
  get(@Param('code') code: string) {
    return this.ingredients.get(code);
  }

  @Get(':code/revisions')
  @ApiOperation({ summary: 'Every revision of an ingredient, newest first' })
  history(@Param('code') code: string) {
    return this.ingredients.history(code);
  }

  @Get(':code/used-in')
  @ApiOperation({ summary: 'Every recipe and product that uses the ingredient at any depth' })
  usedIn(@Param('code') code: string) {
    return this.ingredients.usedIn(code);
  }

  @Post()
  @HttpCode(201)
  @ApiOperation({ summary: 'Add a bought-in ingredient' })
  @ApiZodBody(bookIngredientSchema)
  create(@CurrentUser() user: AuthUser, @Body(new ZodPipe(bookIngredientSchema)) body: BookIngredient) {
    return this.ingredients.create(body, user.id);
  }

  @Put(':code')
  @ApiOperation({ summary: 'Save an ingredient as a new revision' })
  @ApiZodBody(ingredientSaveSchema, 'The ingredient with baseRevision, the revision the editor started from')
  update(
    @CurrentUser() user: AuthUser,
    @Param('code', ItemCodePipe) code: string,
    @Body(new ZodPipe(ingredientSaveSchema)) body: IngredientSave,
  ) {
    return this.ingredients.update(code, body, user.id);
  }
}
