import fs from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { Deps } from './deps';
import { apiNotFound, errorHandler, HttpError } from './http/errors';
import { ApiRouter } from './http/router';
import { healthRoutes } from './health/routes';
import { generatorRoutes } from './generators/routes';
import { calculatorRoutes } from './calculators/routes';
import { authRoutes } from './auth/routes';
import { shopRoutes } from './shops/routes';
import { catalogRoutes } from './catalog/routes';
import { cutRoutes } from './cuts/routes';
import { designRoutes } from './designs/routes';
import { revisionRoutes } from './revisions/routes';
import { archiveRoutes } from './archive/routes';

/** Every feature's routes, in one list: the route-coverage test reads the same list. */
export function buildApi(deps: Deps): ApiRouter {
  const api = new ApiRouter(deps);
  healthRoutes(api);
  generatorRoutes(api);
  calculatorRoutes(api);
  authRoutes(api);
  shopRoutes(api);
  designRoutes(api);
  revisionRoutes(api);
  catalogRoutes(api);
  cutRoutes(api);
  archiveRoutes(api);
  return api;
}

export function createApp(deps: Deps) {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // react-native-web writes its styles into a <style> element at run time.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          frameAncestors: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );
  // One short line per request: method, path, status and time. Never headers: they carry session cookies and tokens.
  app.use(
    pinoHttp({
      logger: deps.log,
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      serializers: {
        req: (req: { id: unknown; method: string; url: string }) => ({ id: req.id, method: req.method, url: req.url.split('?')[0] }),
        res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      },
      redact: ['req.headers.cookie', 'req.headers.authorization'],
    }),
  );
  app.use(cookieParser());

  const api = buildApi(deps);
  app.use('/api', express.json({ limit: '256kb' }), refuseUnreadBodies, api.router);
  app.use('/api', apiNotFound);

  const dist = path.resolve(deps.config.webDist);
  if (fs.existsSync(path.join(dist, 'index.html'))) {
    app.use(express.static(dist, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(dist, 'index.html')));
  }
  app.use(errorHandler(deps.log));
  return { app, api };
}

/**
 * A body the API would not read (text/plain, a form post…) is refused instead of silently
 * ignored: every route takes JSON, and uploads take multipart/form-data (RFC 7578).
 */
const refuseUnreadBodies: express.RequestHandler = (req, _res, next) => {
  const hasBody = Number(req.headers['content-length'] ?? 0) > 0 || req.headers['transfer-encoding'] !== undefined;
  if (hasBody && !req.is(['application/json', 'multipart/form-data'])) {
    return next(new HttpError(415, 'unsupported_media_type', 'Send the request body as JSON (Content-Type: application/json), or files as multipart/form-data'));
  }
  next();
};
