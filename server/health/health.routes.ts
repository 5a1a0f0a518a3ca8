import { Router } from 'express';

/** Mounted at /api/health, public: the start script polls it until the server answers. */
export function healthRoutes(): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    res.json({ ok: true });
  });
  return router;
}
