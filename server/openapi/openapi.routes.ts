import { Router } from 'express';
import { buildOpenApiDocument } from './openapi-document';
import { referencePage } from './reference-page';

/** Mounted at /api: the OpenAPI 3.1 description and its readable reference page; public, like any API description. */
export function openApiRoutes(): Router {
  const router = Router();
  const document = buildOpenApiDocument();
  const page = referencePage(document);
  router.get('/openapi.json', (_req, res) => {
    res.json(document);
  });
  router.get('/reference', (_req, res) => {
    res.type('html').send(page);
  });
  return router;
}
