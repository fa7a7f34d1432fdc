import type { Server } from 'node:http';
import type { INestApplication } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import express, { type NextFunction, type Request, type Response } from 'express';
import { toErrorBody } from './common/filters/api-exception.filter.js';
import { applyServerTimeouts, dropStalledBodies, MAX_JSON_BODY_BYTES, refuseOversizedBodies } from './common/http/request-limits.js';
import { noStoreForApi, securityHeaders } from './common/http/security-headers.js';
import { assignCspNonce, serveSpaIndex } from './spa/spa-index.js';
import { WEATHER_UPLOAD_BODY_LIMIT } from './weather/weather-upload.storage.js';
import { isUiBuilt } from './spa/ui-dist.js';
import type { AppConfig } from './config/app.config.js';

export const API_PREFIX = 'api';

/**
 * Everything the app needs besides its modules, shared by main.ts and the e2e tests so the tests
 * exercise the same pipeline: JSON body parsing with JSON errors, the /api prefix, OpenAPI docs
 * and the "UI not built" page.
 */
export function configureApp(app: INestApplication): void {
  const expressApp = app as NestExpressApplication;
  const config = app.get(ConfigService).get<AppConfig>('app');
  const requestTimeoutMs = config?.requestTimeoutMs ?? 30_000;
  expressApp.disable('x-powered-by');
  // request.ip (the sign-in limit per address) believes X-Forwarded-For only from this many
  // proxies; 0 (the default) keeps express's `trust proxy` off: the connection's address counts.
  const hops = config?.trustProxyHops ?? 0;
  if (hops > 0) expressApp.set('trust proxy', hops);
  applyServerTimeouts(expressApp.getHttpServer() as Server, {
    requestTimeoutMs,
    headersTimeoutMs: Math.min(20_000, requestTimeoutMs),
    keepAliveTimeoutMs: 5_000,
  });
  expressApp.use(assignCspNonce());
  expressApp.use(securityHeaders({ hstsMaxAgeSeconds: config?.hstsMaxAgeSeconds ?? 0, docsPath: `/${API_PREFIX}/docs` }));
  expressApp.use(noStoreForApi(API_PREFIX));
  if (config) expressApp.use(serveSpaIndex(config.uiDistDir));
  expressApp.use(refuseOversizedBodies(MAX_JSON_BODY_BYTES, [WEATHER_UPLOAD_BODY_LIMIT]));
  expressApp.use(dropStalledBodies(requestTimeoutMs));
  // Our own JSON parser (the app is created with bodyParser: false) so that a malformed body
  // gets the API's error shape instead of express's HTML page.
  expressApp.use(express.json({ limit: MAX_JSON_BODY_BYTES }));
  expressApp.use((error: unknown, _request: Request, response: Response, next: NextFunction) => {
    if (!error) return next();
    const body = toErrorBody(error);
    response.status(body.statusCode).json(body);
  });
  app.setGlobalPrefix(API_PREFIX);
  app.enableShutdownHooks();

  const document = SwaggerModule.createDocument(
    app,
    new DocumentBuilder()
      .setTitle('Beamwright API')
      .setDescription(
        [
          'Design, review and commission free-space optical links. SI units (metres, radians, watts); powers in dBm and losses in dB are named so.',
          'Errors answer { statusCode, error, message, issues? }: 400 lists each invalid field by dotted path (e.g. design.transmitter.wavelengthM);',
          'a path id that is not a UUID is a 400, an id that does not exist or belongs to another organisation is a 404; a save on a stale baseRevision is a 409 carrying the latest revision.',
          'Laser safety: transmit powers and any eye-safety figures are indicative, not a certification; the applicable laser-safety standard, local rules and a qualified laser safety officer decide.',
        ].join(' '),
      )
      .setVersion('0.1.0')
      .addBearerAuth()
      .build(),
  );
  SwaggerModule.setup(`${API_PREFIX}/docs`, app, document);

  if (config && !isUiBuilt(config.uiDistDir)) {
    (expressApp.getHttpAdapter().getInstance() as express.Express).get('/', (_request: Request, response: Response) => {
      response
        .status(200)
        .type('text/plain')
        .send(`Beamwright API is running, but the UI is not built (no index.html in ${config.uiDistDir}).\nBuild it with: npm run build -w @beamwright/ui\nAPI: /api, documentation: /api/docs\n`);
    });
  }
}
