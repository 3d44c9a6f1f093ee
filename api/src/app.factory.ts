import 'reflect-metadata';
import { existsSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { Logger, RequestMethod, type LogLevel } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { NestFactory } from '@nestjs/core';
import { FastifyAdapter, type NestFastifyApplication } from '@nestjs/platform-fastify';
import { DocumentBuilder, SwaggerModule, type OpenAPIObject } from '@nestjs/swagger';
import fastifyCookie from '@fastify/cookie';
import fastifyMultipart from '@fastify/multipart';
import fastifyStatic from '@fastify/static';
import { AppModule } from './app.module';
import { refuseCrossSiteRequests } from './auth/cross-site';
import { registerSecurityHeaders } from './auth/security-headers';
import { ApiExceptionFilter } from './common/exception.filter';
import { MAX_JSON_BODY_BYTES, MAX_UPLOAD_BYTES, type BodyLimitConfig } from './common/limits';
import { environmentConfig, sessionCookieSecure, type AppConfig } from './config/config';

const LOG_LEVELS: Record<AppConfig['LOG_LEVEL'], LogLevel[] | false> = {
  silent: false,
  error: ['error', 'fatal'],
  warn: ['error', 'fatal', 'warn'],
  info: ['error', 'fatal', 'warn', 'log'],
  debug: ['error', 'fatal', 'warn', 'log', 'debug', 'verbose'],
};

export interface RouteRecord {
  method: string;
  url: string;
}
const ROUTES = new WeakMap<NestFastifyApplication, RouteRecord[]>();

/** Every route the app registered (HEAD routes that mirror a GET left out), as Fastify saw them. */
export function registeredRoutes(app: NestFastifyApplication): readonly RouteRecord[] {
  return ROUTES.get(app) ?? [];
}

/** Builds the API (and, when a web build is given, serves the web app beside it). */
export async function createApp(options: { logLevel?: AppConfig['LOG_LEVEL'] } = {}): Promise<NestFastifyApplication> {
  const adapter = new FastifyAdapter({ bodyLimit: MAX_JSON_BODY_BYTES, trustProxy: false });
  const app = await NestFactory.create<NestFastifyApplication>(AppModule, adapter, {
    abortOnError: false,
    logger: LOG_LEVELS[options.logLevel ?? environmentConfig().LOG_LEVEL],
  });
  const fastify = app.getHttpAdapter().getInstance();
  const routes: RouteRecord[] = [];
  ROUTES.set(app, routes);
  fastify.addHook('onRoute', (route) => {
    const ownLimit = (route.config as BodyLimitConfig | undefined)?.bodyLimit;
    if (ownLimit !== undefined) route.bodyLimit = ownLimit;
    for (const method of [route.method].flat()) if (method !== 'HEAD') routes.push({ method, url: route.url });
  });
  const config = app.get<ConfigService<AppConfig, true>>(ConfigService);
  // The public product page (public-page/) is served outside /api, as the address a QR code carries.
  app.setGlobalPrefix('api', {
    exclude: [
      { path: 'p/:code', method: RequestMethod.GET },
      { path: 'p/:kitchen/:code', method: RequestMethod.GET },
      { path: 'p/fonts/:file', method: RequestMethod.GET },
    ],
  });
  await app.register(fastifyCookie);
  await app.register(fastifyMultipart, { limits: { fileSize: MAX_UPLOAD_BYTES, files: 1 } });
  registerSecurityHeaders(fastify, { https: sessionCookieSecure(config) });

  const doc = SwaggerModule.createDocument(
    app,
    new DocumentBuilder()
      .setTitle('Crumbproof API')
      .setDescription(
        'Ingredients, recipes, declarations and labels of a pastry kitchen. Sessions are an httpOnly cookie set by POST /api/auth/sign-in.',
      )
      .setVersion('1')
      .addCookieAuth('cp_session')
      .build(),
  );
  SwaggerModule.setup('api/docs', app, doc, { jsonDocumentUrl: 'api/docs-json', useGlobalPrefix: false });
  const publicUrl = config.get('PUBLIC_URL', { infer: true });
  refuseCrossSiteRequests(fastify, { uploadRoutes: uploadRoutesOf(doc), publicOrigin: publicUrl ? new URL(publicUrl).origin : undefined });

  const webDist = config.get('WEB_DIST', { infer: true });
  if (webDist) serveWeb(app, resolve(webDist));
  await app.init();
  await fastify.ready();
  return app;
}

/** The routes the OpenAPI document says take multipart/form-data (see ApiUpload), as "POST /api/x/:code". */
export function uploadRoutesOf(doc: OpenAPIObject): Set<string> {
  const found = new Set<string>();
  for (const [path, item] of Object.entries(doc.paths)) {
    for (const [method, op] of Object.entries(item as Record<string, { requestBody?: { content?: Record<string, unknown> } }>)) {
      if (op?.requestBody?.content?.['multipart/form-data']) found.add(`${method.toUpperCase()} ${path.replace(/\{([^}]+)\}/g, ':$1')}`);
    }
  }
  return found;
}

/** Serves the built web app; any other non-API GET falls back to index.html for the client router. */
function serveWeb(app: NestFastifyApplication, dir: string) {
  const index = join(dir, 'index.html');
  if (!existsSync(index)) {
    new Logger('Web').warn(`No web build at ${dir}: run npm run build.`);
    return;
  }
  void app
    .getHttpAdapter()
    .getInstance()
    .register(fastifyStatic, { root: dir, prefix: '/', wildcard: false, index: ['index.html'] });
  ApiExceptionFilter.webFallbackHtml = readFileSync(index, 'utf8');
}
