import { MulterError } from 'multer';
import { BadRequest, TooLarge } from '../errors';

/**
 * What a failed multipart upload answers, for every upload route (setup files and git
 * bundles): a file over the route's limit is 413 with that limit, a form that is not
 * one file in the field "file" is 400 `invalid-upload`, and a body busboy could not
 * read (cut off, a broken part header) is 400 `malformed-upload`: all the client's.
 */
export function uploadError(error: unknown, limit: { bytes: number; tooLarge: string }): Error {
  if (!(error instanceof MulterError)) {
    return error instanceof Error && !('status' in error)
      ? new BadRequest(`The upload could not be read: ${error.message}.`, { code: 'malformed-upload' })
      : error instanceof Error
        ? error
        : new Error('The upload could not be read.', { cause: error });
  }
  switch (error.code) {
    case 'LIMIT_FILE_SIZE':
      return new TooLarge(limit.tooLarge, { details: { limit: limit.bytes } });
    case 'LIMIT_UNEXPECTED_FILE':
    case 'LIMIT_FILE_COUNT':
      return new BadRequest('Send exactly one file, in the form field named "file".', {
        code: 'invalid-upload',
        details: { field: error.field ?? null },
      });
    default:
      return new BadRequest(`The upload form is not acceptable: ${error.message}.`, {
        code: 'invalid-upload',
        details: { reason: error.code },
      });
  }
}
