import type { ErrorRequestHandler, RequestHandler } from 'express';
import { BaseError, ConnectionError, DatabaseError, UniqueConstraintError } from 'sequelize';
import { HttpError, NotFound } from '../errors';

interface ErrorBody {
  status: number;
  code: string;
  message: string;
  details?: Record<string, unknown>;
}

// PostgreSQL SQLSTATE classes that mean the server is away or going away:
// 08 connection exception, 57P operator intervention (shutdown, cannot connect now).
const UNAVAILABLE_SQLSTATE = /^(08|57P)/;
const UNAVAILABLE_MESSAGE =
  /Connection terminated|ECONNRESET|ECONNREFUSED|not queryable|Client has encountered a connection error/i;
// Data errors PostgreSQL raises for values the API let through: still the caller's input.
const INPUT_SQLSTATE = /^22/;

function sqlState(error: DatabaseError): string | undefined {
  const original = error.original as { code?: unknown } | undefined;
  return typeof original?.code === 'string' ? original.code : undefined;
}

const databaseUnavailable: ErrorBody = {
  status: 503,
  code: 'database-unavailable',
  message: 'The database is unavailable. Try again shortly.',
};

// body-parser marks its failures with `type`; each is the caller's doing.
function bodyParserError(error: { type?: unknown; status?: unknown }): ErrorBody | null {
  switch (error.type) {
    case 'entity.parse.failed':
      return { status: 400, code: 'malformed-json', message: 'The request body is not valid JSON.' };
    case 'entity.too.large':
      return { status: 413, code: 'too-large', message: 'The request body is too large.' };
    case 'encoding.unsupported':
    case 'charset.unsupported':
      return {
        status: 415,
        code: 'unsupported-media-type',
        message: 'The request body uses an encoding this server does not accept.',
      };
    case 'request.aborted':
    case 'request.size.invalid':
      return { status: 400, code: 'bad-request', message: 'The request body arrived incomplete.' };
    default:
      return null;
  }
}

export function describeError(error: unknown): ErrorBody | null {
  if (error instanceof HttpError)
    return { status: error.status, code: error.code, message: error.message, details: error.details };
  if (error instanceof ConnectionError) return databaseUnavailable;
  if (error instanceof UniqueConstraintError) return { status: 409, code: 'conflict', message: 'This already exists.' };
  if (error instanceof DatabaseError) {
    const state = sqlState(error);
    if ((state && UNAVAILABLE_SQLSTATE.test(state)) || UNAVAILABLE_MESSAGE.test(error.message))
      return databaseUnavailable;
    if (state && INPUT_SQLSTATE.test(state))
      return { status: 400, code: 'invalid-input', message: 'A value in the request is not acceptable.' };
  }
  if (error instanceof BaseError && UNAVAILABLE_MESSAGE.test(error.message)) return databaseUnavailable;
  if (error && typeof error === 'object') {
    const parsed = bodyParserError(error);
    if (parsed) return parsed;
    // Other client errors raised by Express itself (e.g. a path that cannot be decoded).
    const status = (error as { status?: unknown }).status;
    if (typeof status === 'number' && status >= 400 && status < 500) {
      return status === 404
        ? { status, code: 'not-found', message: 'Not found.' }
        : { status, code: 'bad-request', message: 'The request is not valid.' };
    }
  }
  return null;
}

export function errorHandler(options: { logErrors: boolean }): ErrorRequestHandler {
  return (error, _req, res, next) => {
    if (res.headersSent) return next(error);
    const known = describeError(error);
    if (!known || known.status >= 500) {
      if (options.logErrors) console.error(known ? `[${known.code}]` : '[internal-error]', error);
    }
    const body = known ?? { status: 500, code: 'internal-error', message: 'Something went wrong on our side.' };
    res.status(body.status).json({ error: { code: body.code, message: body.message, details: body.details ?? {} } });
  };
}

export const unknownApiRoute: RequestHandler = (req) => {
  throw new NotFound(`There is no ${req.method} ${req.baseUrl}${req.path}.`, { code: 'no-such-route' });
};
