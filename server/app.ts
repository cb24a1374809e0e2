// The Express 5 app: security headers, JSON bodies, logging, the API, the built client, one error handler.
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { ServerContext } from './context.ts';
import { notFound } from './errors.ts';
import { errorHandler } from './middleware/errorHandler.ts';
import { refuseNul } from './middleware/refuseNul.ts';
import { createApiRouter } from './routes/index.ts';

export const JSON_BODY_LIMIT = '1mb';

export function createApp(ctx: ServerContext): Express {
  const app = express();
  app.disable('x-powered-by');
  if (ctx.config.trustProxy !== null) app.set('trust proxy', ctx.config.trustProxy);
  // No upgrade-insecure-requests: a team may serve Stanchion over plain HTTP on its own network.
  app.use(helmet({ contentSecurityPolicy: { directives: { upgradeInsecureRequests: null } } }));
  app.use(pinoHttp({ logger: ctx.log }));
  app.use(express.json({ limit: JSON_BODY_LIMIT }));
  app.use('/api', refuseNul);

  // API replies are per user and change with every edit: never cached by browsers or proxies.
  app.use('/api', (_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  app.use('/api', createApiRouter(ctx));
  app.use('/api', (req, _res, next) => next(notFound(`Route ${req.method} /api${req.path}`)));

  serveClient(app, ctx.config.distDir);
  app.use((req, _res, next) => next(notFound(`Page ${req.path}`)));
  app.use(errorHandler);
  return app;
}

function serveClient(app: Express, distDir: string): void {
  const indexHtml = resolve(distDir, 'index.html');
  // Vite puts hashed file names under assets/, so they may be cached for a year.
  app.use('/assets', express.static(resolve(distDir, 'assets'), { immutable: true, maxAge: '1y', fallthrough: true }));
  app.use(express.static(distDir, { index: false, maxAge: '1h' }));
  app.get('/{*splat}', (req, res, next) => {
    if (req.path.startsWith('/socket.io') || !existsSync(indexHtml)) {
      next();
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexHtml);
  });
}
