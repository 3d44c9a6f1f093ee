import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { Body, Controller, Get, Param, Put, Req, Res } from '@nestjs/common';
import { ApiExcludeEndpoint, ApiOperation, ApiTags } from '@nestjs/swagger';
import type { FastifyReply, FastifyRequest } from 'fastify';
import { KITCHEN_WRITERS, publicPageSettingsSchema, type PublicPageSettings } from '@crumbproof/shared';
import { Public, Roles } from '../common/roles.decorator';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { notFoundPage, PAGE_FONTS, tooManyPage, type PublicPage } from './public-page-html';
import { PublicPageRate } from './public-page-rate';
import { PublicPageService } from './public-page.service';

/** The shipped font (@fontsource/atkinson-hyperlegible, SIL Open Font License), read once. */
const FONT_DIR = join(dirname(require.resolve('@fontsource/atkinson-hyperlegible/package.json')), 'files');
const FONTS = new Map(Object.entries(PAGE_FONTS).map(([file, f]) => [file, readFileSync(join(FONT_DIR, f.source))]));

function send(reply: FastifyReply, page: PublicPage) {
  return reply
    .status(page.status)
    .header('Cache-Control', 'no-store')
    .header('X-Robots-Tag', 'noindex')
    .type('text/html; charset=utf-8')
    .send(page.html);
}

/** The manager's settings of the public product page (/api/public-page/settings). */
@ApiTags('public-page')
@Controller('public-page')
export class PublicPageSettingsController {
  constructor(private readonly pages: PublicPageService) {}

  @Get('settings')
  @Roles(KITCHEN_WRITERS)
  @ApiOperation({
    summary:
      'Whether the public product page is on, and the address customers reach it at (manager, pastry chef: the label preview draws its QR codes)',
  })
  settings() {
    return this.pages.settings();
  }

  @Put('settings')
  @Roles(['manager'])
  @ApiOperation({ summary: 'Turn the public product page on or off and set the address its QR codes point at (manager)' })
  @ApiZodBody(publicPageSettingsSchema)
  save(@Body(new ZodPipe(publicPageSettingsSchema)) body: PublicPageSettings) {
    return this.pages.saveSettings(body);
  }
}

/**
 * The public product page itself, outside /api and the signed-in app: plain HTML with no script,
 * for a customer who scans a counter ticket's QR code. No sign-in.
 */
@Controller('p')
export class PublicPageController {
  constructor(
    private readonly pages: PublicPageService,
    private readonly rate: PublicPageRate,
  ) {}

  @Get('fonts/:file')
  @Public()
  @ApiExcludeEndpoint()
  font(@Param('file') file: string, @Res() reply: FastifyReply) {
    const font = FONTS.get(file);
    if (!font) return send(reply, notFoundPage());
    return reply.header('Cache-Control', 'public, max-age=31536000, immutable').type('font/woff2').send(font);
  }

  /** A product's page at an installation of one kitchen (with several, a page in words asking which kitchen's). */
  @Get(':code')
  @Public()
  @ApiExcludeEndpoint()
  async page(@Param('code') code: string, @Req() request: FastifyRequest, @Res() reply: FastifyReply) {
    return send(reply, (await this.rate.take(request.ip)) ? await this.pages.page(code) : tooManyPage());
  }

  /** A product's page at one kitchen, named by its id in the recipe book. */
  @Get(':kitchen/:code')
  @Public()
  @ApiExcludeEndpoint()
  async kitchenPage(
    @Param('kitchen') kitchen: string,
    @Param('code') code: string,
    @Req() request: FastifyRequest,
    @Res() reply: FastifyReply,
  ) {
    return send(reply, (await this.rate.take(request.ip)) ? await this.pages.page(code, kitchen) : tooManyPage());
  }
}
