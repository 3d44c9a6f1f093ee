import { Controller, Get, Header, HttpCode, Post, Req } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import type { FastifyRequest } from 'fastify';
import { KITCHEN_WRITERS } from '@crumbproof/shared';
import { CurrentUser, type AuthUser } from '../../common/current-user.decorator';
import { Roles } from '../../common/roles.decorator';
import { ApiUpload, readUpload } from '../../common/multipart-upload';
import { IngredientImportService } from './ingredient-import.service';
import { templateCsv, templateXlsx } from './import-template';

@ApiTags('ingredients')
@Controller('ingredients/import')
@Roles(KITCHEN_WRITERS)
export class IngredientImportController {
  constructor(private readonly imports: IngredientImportService) {}

  @Get('template.csv')
  @Header('Cache-Control', 'private, no-store')
  @Header('X-Content-Type-Options', 'nosniff')
  @ApiOperation({ summary: 'A CSV template to fill in: the header row of every column the import reads' })
  template() {
    return templateCsv();
  }

  @Get('template.xlsx')
  @Header('Cache-Control', 'private, no-store')
  @Header('X-Content-Type-Options', 'nosniff')
  @ApiOperation({
    summary: 'An .xlsx template to fill in: the header row of every column the import reads, and a sheet saying what each column means',
  })
  workbookTemplate() {
    return templateXlsx();
  }

  @Post('preview')
  @HttpCode(200)
  @ApiOperation({
    summary: 'Read a CSV file or an .xlsx workbook of ingredients: what each row would become, and its problems; nothing is saved',
  })
  @ApiUpload()
  async preview(@Req() req: FastifyRequest) {
    return this.imports.preview(await readUpload(req, []));
  }

  @Post()
  @HttpCode(200)
  @ApiOperation({
    summary:
      "Import a CSV file or an .xlsx workbook of ingredients in one transaction, with the preview's basis in the field basis; refused, saving nothing, when any row has a problem (400) or any row's ingredient was saved or created since the preview (409 stale-preview)",
  })
  @ApiUpload({
    basis: {
      description:
        "The preview's basis, as the preview gave it (a JSON object from row number to a token of the state its ingredient was in)",
      required: true,
    },
  })
  async import(@CurrentUser() user: AuthUser, @Req() req: FastifyRequest) {
    return this.imports.import(await readUpload(req, ['basis']), user.id);
  }
}
