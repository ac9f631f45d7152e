import type { RequestHandler } from 'express';
import { UnsupportedMediaType } from '../errors';

// Bodies the API reads: JSON everywhere, YAML or plain text for setups, multipart for
// file uploads. Anything else is refused up front instead of arriving as an empty body.
const ACCEPTED = [
  'application/json',
  'application/*+json',
  'multipart/form-data',
  'text/plain',
  'application/yaml',
  'application/x-yaml',
  'text/yaml',
  'text/x-yaml',
];

export const acceptedBodies: RequestHandler = (req, _res, next) => {
  // req.is answers null when the request has no body; an empty one (Content-Length: 0,
  // as fetch sends for a bare POST) is no body either.
  if (req.get('content-length') !== '0' && req.is(ACCEPTED) === false) {
    throw new UnsupportedMediaType(
      `Send the body as JSON (Content-Type: application/json), not ${req.get('content-type') ?? 'an unnamed type'}.`,
      {
        details: { content_type: req.get('content-type') ?? null },
      },
    );
  }
  next();
};
