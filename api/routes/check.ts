import express, { Router } from 'express';
import { z } from 'zod';
import { analyzeSetup } from '@shared/analyze';
import { MAX_TEXT_BYTES } from '@shared/parse/limits';
import { BadRequest } from '../errors';
import { parseInput } from '../validation';

export const YAML_TYPES = ['text/plain', 'application/yaml', 'application/x-yaml', 'text/yaml', 'text/x-yaml'];

const jsonBody = z.object({ yaml: z.string({ error: 'Send the setup text as "yaml".' }) });

// Public and stateless: checks a setup text and stores nothing.
export function checkRouter(): Router {
  const router = Router();

  router.post('/check', express.text({ type: YAML_TYPES, limit: MAX_TEXT_BYTES }), (req, res) => {
    let text: string;
    if (typeof req.body === 'string') text = req.body;
    else if (req.is('application/json')) text = parseInput(jsonBody, req.body).yaml;
    else
      throw new BadRequest('Send the setup text as the body, with Content-Type: application/yaml (or text/plain).', {
        code: 'missing-body',
      });

    const { readable, findings, counts } = analyzeSetup(text);
    res.json({ data: { readable, findings, errors: counts.errors, warnings: counts.warnings, infos: counts.infos } });
  });

  return router;
}
