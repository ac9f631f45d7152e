import { createHash } from 'node:crypto';
import { analyzeSetup, type Analysis } from '@shared/analyze';
import { canonicalJsonOfChecked } from '@shared/canonical/content-hash';
import { AIRFRAMES, FORMAT_ID } from '@shared/format/schema';
import { namesSetupFormat, SETUP_FILE_SHAPE } from '@shared/format/setup-header';
import { MAX_TEXT_BYTES } from '@shared/parse/limits';
import { TooLarge, Unprocessable } from '../errors';

/** Setup text that has been read and checked, ready to be stored. */
export interface CheckedSetup {
  text: string;
  analysis: Analysis & { readable: true };
  contentHash: string;
  /** The data as JSON text, made once for the NUL check and the insert's jsonb. */
  documentJson: string;
}

// PostgreSQL's text and jsonb cannot hold U+0000, so such a setup could not be stored
// as sent; it is refused rather than altered.
const NUL = '\u0000';

/**
 * Reads and checks setup text before anything is stored (and before any lock is
 * taken). Unreadable text is refused with its syntax findings; a readable setup with
 * check errors is accepted: history keeps everything.
 */
export function checkSetupText(text: string): CheckedSetup {
  const bytes = Buffer.byteLength(text, 'utf8');
  if (bytes > MAX_TEXT_BYTES) {
    throw new TooLarge(
      `The setup is ${Math.ceil(bytes / 1024)} KB; setups up to ${MAX_TEXT_BYTES / 1024} KB are accepted.`,
      {
        details: { bytes, limit: MAX_TEXT_BYTES },
      },
    );
  }
  const analysis = analyzeSetup(text);
  if (!analysis.readable) {
    const first = analysis.findings[0];
    const where = first ? ` (line ${first.line}, column ${first.column}: ${first.message})` : '';
    throw new Unprocessable(`The setup could not be read as YAML, so nothing was saved${where}.`, {
      code: 'unreadable-setup',
      details: { findings: analysis.findings, counts: analysis.counts },
    });
  }
  const documentJson = JSON.stringify(analysis.data);
  if (text.includes(NUL) || documentJson.includes('\\u0000')) {
    throw new Unprocessable('The setup contains a NUL character (\\0), which cannot be stored; nothing was saved.', {
      code: 'unreadable-setup',
      details: { findings: [] },
    });
  }
  return {
    text,
    analysis: analysis as CheckedSetup['analysis'],
    // The same SHA-256 as contentHash, by node's own implementation.
    contentHash: createHash('sha256')
      .update(canonicalJsonOfChecked(analysis.data, analysis.setup), 'utf8')
      .digest('hex'),
    documentJson,
  };
}

/**
 * Like `checkSetupText`, for text that is to start a model or arrive as a file: it must
 * say it is a setup (`format: bindery-setup/1`), or nothing is stored.
 */
export function checkSetupDocument(text: string): CheckedSetup {
  const setup = checkSetupText(text);
  if (!namesSetupFormat(setup.analysis.data)) {
    const format = (setup.analysis.data as { format?: unknown }).format;
    const said = format === undefined ? 'has no format line' : `says format: ${JSON.stringify(format)}`;
    throw new Unprocessable(
      `This file is not a Bindery setup: it ${said}, where a setup says "format: ${FORMAT_ID}". Nothing was saved. ${SETUP_FILE_SHAPE}`,
      { code: 'not-a-setup', details: { format: format ?? null, expected: FORMAT_ID } },
    );
  }
  return setup;
}

/** The airframe kind a setup names, when it names one the format knows. */
export function airframeOf(data: unknown): string | null {
  const model = (data as { model?: { airframe?: unknown } } | null)?.model;
  const airframe = model && typeof model === 'object' ? model.airframe : undefined;
  return typeof airframe === 'string' && (AIRFRAMES as readonly string[]).includes(airframe) ? airframe : null;
}
