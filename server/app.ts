import fs from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { Deps } from './deps';
import { apiNotFound, errorHandler } from './http/errors';
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
  app.use(pinoHttp({ logger: deps.log, autoLogging: { ignore: (req) => req.url === '/api/health' } }));
  app.use(cookieParser());

  const api = buildApi(deps);
  app.use('/api', express.json({ limit: '256kb' }), api.router);
  app.use('/api', apiNotFound);

  const dist = path.resolve(deps.config.webDist);
  if (fs.existsSync(path.join(dist, 'index.html'))) {
    app.use(express.static(dist, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(dist, 'index.html')));
  }
  app.use(errorHandler(deps.log));
  return { app, api };
}
