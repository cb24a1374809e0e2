import { createRouter, createWebHistory, type Router } from 'vue-router';
import { routes } from './routes.ts';
import { installAuthGuard } from './guards.ts';

/** Call after Pinia is installed: the guard reads the auth store. */
export function createAppRouter(): Router {
  const router = createRouter({ history: createWebHistory(), routes });
  installAuthGuard(router);
  return router;
}
