import type { Router } from 'express';
import { z } from 'zod';
import { SERIES } from '../../shared/catalogue/index.ts';
import type { ServerContext } from '../context.ts';
import { requireAuth } from '../middleware/auth.ts';
import { parseQuery } from '../middleware/validate.ts';
import { findSections } from '../services/sections.ts';

const sectionQuerySchema = z.object({
  q: z.string().trim().max(80).default(''),
  series: z.enum(SERIES).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(50),
});

export function registerSectionRoutes(router: Router, ctx: ServerContext): void {
  router.get('/sections', requireAuth(ctx), (req, res) => {
    const { q, series, limit } = parseQuery(sectionQuerySchema, req);
    res.json(findSections(q, series, limit));
  });
}
