import { Router } from 'express';
import { setupJsonSchemaText } from '../../shared/format/json-schema';

// The published JSON Schema of the setup format, for editors and other tools.
export function schemaRouter(): Router {
  const router = Router();
  let text: string | null = null;

  router.get('/schema/setup-1.json', (_req, res) => {
    text ??= setupJsonSchemaText();
    res.type('application/schema+json').set('Cache-Control', 'public, max-age=300').send(text);
  });

  return router;
}
