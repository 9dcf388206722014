import 'reflect-metadata';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import compression from 'compression';
import type { Express, NextFunction, Request, Response } from 'express';
import helmet from 'helmet';
import { Logger } from 'nestjs-pino';
import { cleanupOpenApiDoc } from 'nestjs-zod';
import { finishOpenApiDoc } from './common/openapi-finish.js';
import { AppModule } from './app.module.js';
import { toErrorBody } from './common/error-body.js';
import { type AppConfig, loadConfig } from './config/config.js';
import { mountWebApp } from './web/static-web.js';

/** Builds the whole HTTP application (API, docs, PWA) without listening. */
export async function createApp(config: AppConfig = loadConfig()): Promise<NestExpressApplication> {
  const app = await NestFactory.create<NestExpressApplication>(AppModule.forRoot(config), { bufferLogs: true, bodyParser: false });
  app.useLogger(app.get(Logger));
  app.enableShutdownHooks();
  app.set('trust proxy', config.TRUST_PROXY);
  app.disable('x-powered-by');
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'img-src': ["'self'", 'data:', 'blob:'],
          // blob: for the photo-compression worker, which browser-image-compression starts from a blob URL.
          'worker-src': ["'self'", 'blob:'],
          'connect-src': ["'self'"],
          'upgrade-insecure-requests': null,
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );
  // API answers above 1 KiB go out compressed (gzip/deflate by Accept-Encoding); built assets are
  // precompressed at build time and carry their own Content-Encoding, which compression leaves alone.
  // Sync answers are megabytes built per request (a pull page of a thousand findings is ~2 MB of
  // JSON): they get zlib's fastest level, about half the CPU of the default for a page a few KB larger.
  const syncRoute = (req: Request) => req.originalUrl.startsWith('/api/sync/');
  app.use('/api/sync', compression({ threshold: 1024, level: 1 }));
  app.use('/api', compression({ threshold: 1024, filter: (req, res) => !syncRoute(req) && compression.filter(req, res) }));
  app.useBodyParser('json', { limit: config.MAX_JSON_BODY });
  app.setGlobalPrefix('api');

  const openApi = new DocumentBuilder()
    .setTitle('Plummet API')
    .setDescription('Scaffold falling-object inspections: sites, scaffolds, inspections, findings, photos, sync.')
    .setVersion('0.1.0')
    .addBearerAuth()
    .build();
  SwaggerModule.setup('api/docs', app, () => finishOpenApiDoc(cleanupOpenApiDoc(SwaggerModule.createDocument(app, openApi))), {
    jsonDocumentUrl: 'api/docs/openapi.json',
  });

  const express = app.getHttpAdapter().getInstance() as Express;
  mountWebApp(express, config.WEB_DIST);
  await app.init();
  express.use('/api', (_req: Request, res: Response) => {
    res.status(404).json({ code: 'NOT_FOUND', message: 'No such API route' });
  });
  // Errors from plain Express middleware (static files) get the same body as the API's.
  express.use((error: unknown, _req: Request, res: Response, next: NextFunction) => {
    if (res.headersSent) return next(error);
    const { status, body } = toErrorBody(error);
    res.status(status).json(body);
  });
  return app;
}
