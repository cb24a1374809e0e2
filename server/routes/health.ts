import type { Router } from 'express';
import type { ServerContext } from '../context.ts';
import { databaseKind } from '../db.ts';

export interface HealthResponse {
  ok: true;
  version: string;
  database: 'sqlite' | 'postgres';
}

export function registerHealthRoutes(router: Router, ctx: ServerContext): void {
  router.get('/health', async (_req, res) => {
    await ctx.db.raw('select 1');
    const out: HealthResponse = { ok: true, version: ctx.config.version, database: databaseKind(ctx.config) };
    res.json(out);
  });
}
