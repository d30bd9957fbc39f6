import { Router } from 'express';
import { buildOpenApiDocument } from './openapi.document';

/** `GET /api/openapi.json`: built once, on the first request. */
export function openApiRoutes(): Router {
  const router = Router();
  let document: ReturnType<typeof buildOpenApiDocument> | undefined;
  router.get('/', (_req, res) => {
    document ??= buildOpenApiDocument();
    res.json(document);
  });
  return router;
}
