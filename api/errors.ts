// Every failure a handler can answer with. Handlers throw these; the one error
// middleware (middleware/error-handler.ts) turns them into
// `{ error: { code, message, details } }` with the status carried here.

export type ErrorDetails = Record<string, unknown> | undefined;

export interface HttpErrorOptions {
  code?: string;
  details?: ErrorDetails;
}

export class HttpError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details: ErrorDetails;

  constructor(status: number, defaultCode: string, message: string, options: HttpErrorOptions = {}) {
    super(message);
    this.name = new.target.name;
    this.status = status;
    this.code = options.code ?? defaultCode;
    this.details = options.details;
  }
}

export class BadRequest extends HttpError {
  constructor(message = 'The request is not valid.', options?: HttpErrorOptions) {
    super(400, 'bad-request', message, options);
  }
}

export class Unauthorized extends HttpError {
  constructor(message = 'Sign in to continue.', options?: HttpErrorOptions) {
    super(401, 'unauthorized', message, options);
  }
}

export class Forbidden extends HttpError {
  constructor(message = 'You may not do this.', options?: HttpErrorOptions) {
    super(403, 'forbidden', message, options);
  }
}

/** The one wording of a role too low, for every guard and for the one-statement save. */
export const roleTooLow = (required: string, role: string) =>
  new Forbidden(`This needs the ${required} role or higher; your role here is ${role}.`, {
    code: 'role-too-low',
    details: { required, role },
  });

export class NotFound extends HttpError {
  constructor(message = 'Not found.', options?: HttpErrorOptions) {
    super(404, 'not-found', message, options);
  }
}

export class Conflict extends HttpError {
  constructor(message = 'This conflicts with the current state.', options?: HttpErrorOptions) {
    super(409, 'conflict', message, options);
  }
}

export class TooLarge extends HttpError {
  constructor(message = 'The request body is too large.', options?: HttpErrorOptions) {
    super(413, 'too-large', message, options);
  }
}

export class UnsupportedMediaType extends HttpError {
  constructor(message = 'This content type is not accepted here.', options?: HttpErrorOptions) {
    super(415, 'unsupported-media-type', message, options);
  }
}

export class Unprocessable extends HttpError {
  constructor(message = 'The request cannot be processed.', options?: HttpErrorOptions) {
    super(422, 'unprocessable', message, options);
  }
}

export class RateLimited extends HttpError {
  constructor(message = 'Too many attempts. Wait a while and try again.', options?: HttpErrorOptions) {
    super(429, 'rate-limited', message, options);
  }
}

export class ServiceUnavailable extends HttpError {
  constructor(message = 'The service is unavailable. Try again shortly.', options?: HttpErrorOptions) {
    super(503, 'service-unavailable', message, options);
  }
}
