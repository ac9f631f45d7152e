import type { Request, Response } from 'express';
import multer from 'multer';
import path from 'node:path';
import { MAX_TEXT_BYTES } from '@shared/parse/limits';
import { BadRequest, UnsupportedMediaType } from '../errors';
import { uploadError } from './upload-error';

/** The same limit as for setup text sent as JSON: the parser reads nothing larger. */
export const MAX_UPLOAD_BYTES = MAX_TEXT_BYTES;

export interface SetupUpload {
  text: string;
  /** The client's file name without any folder part, for messages only. */
  fileName: string;
  /** The other form fields, as strings. */
  fields: Record<string, unknown>;
}

const parser = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 8, fieldSize: 8 * 1024, parts: 9, fieldNestingDepth: 0 },
  defParamCharset: 'utf8',
}).single('file');

const YAML_NAME = /\.ya?ml$/i;
// Types browsers and tools send for YAML and plain text. application/octet-stream is
// what a browser sends when it does not know the extension; it counts only for a
// .yaml or .yml file.
const TEXT_TYPES = /^(text\/[a-z0-9.+-]+|application\/(x-)?yaml)$/i;
const UNKNOWN_TYPES = /^(application\/octet-stream)?$/i;

const LIMIT = {
  bytes: MAX_UPLOAD_BYTES,
  tooLarge: `The file is larger than ${MAX_UPLOAD_BYTES / 1024} KB; a setup is normally a few kilobytes.`,
};

function decodeUtf8(buffer: Buffer): string | null {
  try {
    // ignoreBOM keeps a byte-order mark in the text, so a download gives back the same bytes.
    return new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(buffer);
  } catch {
    return null;
  }
}

/**
 * Reads one setup file from a multipart form (field `file`): at most 512 KB (413
 * beyond), a .yaml/.yml file or a text content type (415 otherwise), UTF-8 text.
 * Call it after authorising, so nothing is read for a caller who may not upload.
 */
export async function readSetupUpload(req: Request, res: Response): Promise<SetupUpload> {
  if (!req.is('multipart/form-data')) {
    throw new UnsupportedMediaType('Upload the setup as multipart/form-data with the file in the field "file".', {
      details: { content_type: req.get('content-type') ?? null },
    });
  }
  await new Promise<void>((resolve, reject) =>
    parser(req, res, (error?: unknown) => (error ? reject(uploadError(error, LIMIT)) : resolve())),
  );
  const file = req.file;
  if (!file)
    throw new BadRequest('No file arrived: put the setup in the form field named "file".', { code: 'file-missing' });

  const fileName = path.basename(file.originalname.replace(/\\/g, '/')).slice(0, 120);
  const mimetype = file.mimetype.split(';')[0].trim();
  const acceptable = TEXT_TYPES.test(mimetype) || (YAML_NAME.test(fileName) && UNKNOWN_TYPES.test(mimetype));
  if (!acceptable) {
    throw new UnsupportedMediaType(
      `"${fileName}" (${mimetype || 'no type'}) is not a YAML file: upload a .yaml or .yml file or plain text.`,
      {
        details: { file_name: fileName, content_type: mimetype || null },
      },
    );
  }
  const text = decodeUtf8(file.buffer);
  if (text === null || text.includes('\u0000')) {
    throw new UnsupportedMediaType(
      `"${fileName}" is not plain text: a setup file is text saved in the usual encoding (UTF-8), as any text editor writes it.`,
      {
        code: 'unsupported-media-type',
        details: { file_name: fileName },
      },
    );
  }
  return { text, fileName, fields: (req.body ?? {}) as Record<string, unknown> };
}
