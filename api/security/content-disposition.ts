import type { Response } from 'express';

// Every download names its file through here, so no route can hand the browser a
// name with a folder part, control or direction-changing characters, quotes, or
// characters file systems refuse. Express (the content-disposition package) then
// quotes it and adds an RFC 5987 `filename*` for letters outside ASCII.

const MAX_LENGTH = 120;
// C0/C1 controls, bidirectional overrides and isolates, zero-width characters and
// the byte-order mark: invisible, or able to make "gpj.exe" look like "exe.jpg".
const INVISIBLE = /[\u0000-\u001f\u007f-\u009f\u200b-\u200f\u202a-\u202e\u2060-\u2069\ufeff]/g;
const RESERVED = /[<>:"|?*;\\/%]/g;

export function safeDownloadName(name: string, fallback = 'download'): string {
  const lastSegment = name.normalize('NFC').split(/[\\/]/).pop() ?? '';
  let clean = lastSegment
    .replace(INVISIBLE, '')
    .replace(RESERVED, '-')
    .replace(/\s+/g, ' ')
    .trim()
    .replace(/^[.\s]+/, '')
    .replace(/[.\s]+$/, '');
  if (clean.length > MAX_LENGTH) {
    const dot = clean.lastIndexOf('.');
    const extension = dot > 0 && clean.length - dot <= 16 ? clean.slice(dot) : '';
    clean = clean.slice(0, MAX_LENGTH - extension.length).replace(/[.\s-]+$/, '') + extension;
  }
  return clean.length > 0 ? clean : fallback;
}

/** Marks the answer as a file to save under a sanitised `name`. */
export function sendAsDownload(res: Response, name: string): void {
  res.attachment(safeDownloadName(name));
}
