import { readFile } from 'node:fs/promises';
import { Router } from 'express';

// The published JSON Schema of the setup format, for editors and other tools: the
// committed file itself, so what is served is exactly what is published.
const SCHEMA_FILE = new URL('../../shared/format/setup-1.schema.json', import.meta.url);

export function schemaRouter(): Router {
  const router = Router();
  let text: Promise<string> | null = null;

  router.get('/schema/setup-1.json', async (_req, res) => {
    text ??= readFile(SCHEMA_FILE, 'utf8').catch((error: unknown) => {
      text = null;
      throw error;
    });
    res
      .type('application/schema+json')
      .set('Cache-Control', 'public, max-age=300')
      .send(await text);
  });

  return router;
}
