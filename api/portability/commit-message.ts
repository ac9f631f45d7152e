// A revision's commit message: the revision's message exactly as stored, then one
// paragraph of trailers that carry what git has no field for. Import reads the last
// paragraph back as those trailers, so any message (several paragraphs, lines that
// look like trailers) comes back byte for byte.

export interface RevisionTrailers {
  /** The model's folder in a workspace export; absent in a single model's. */
  folder?: string;
  modelName: string;
  number: number;
  contentHash: string;
}

const EMPTY_SUBJECT = (number: number) => `Revision ${number}`;

function oneLine(value: string): string {
  return value.replace(/[\r\n]+/g, ' ');
}

export function formatCommitMessage(message: string, trailers: RevisionTrailers): string {
  const lines = [
    ...(trailers.folder !== undefined ? [`Bindery-Folder: ${trailers.folder}`] : []),
    `Bindery-Model: ${oneLine(trailers.modelName)}`,
    `Bindery-Revision: ${trailers.number}`,
    `Bindery-Content-Hash: ${trailers.contentHash}`,
  ];
  // git log needs a subject line; an empty message gets one, marked so import drops it.
  if (message.length === 0)
    return `${EMPTY_SUBJECT(trailers.number)}\n\n${[...lines, 'Bindery-Empty-Message: true'].join('\n')}\n`;
  return `${message}\n\n${lines.join('\n')}\n`;
}

export interface ParsedMessage {
  message: string;
  trailers: Partial<RevisionTrailers> | null;
}

const TRAILER = /^Bindery-([A-Za-z-]+): (.*)$/;

/** The revision message and Bindery's trailers; a message without them is taken whole (trimmed). */
export function parseCommitMessage(raw: string): ParsedMessage {
  const text = raw.replace(/\n$/, '');
  const split = text.lastIndexOf('\n\n');
  const last = split >= 0 ? text.slice(split + 2) : '';
  const lines = last.split('\n');
  if (
    split < 0 ||
    !lines.every((line) => TRAILER.test(line)) ||
    !lines.some((line) => line.startsWith('Bindery-Revision: '))
  ) {
    return { message: text.trim(), trailers: null };
  }
  const values = new Map(lines.map((line) => TRAILER.exec(line)!.slice(1, 3) as [string, string]));
  const number = Number(values.get('Revision'));
  const trailers: Partial<RevisionTrailers> = {
    folder: values.get('Folder'),
    modelName: values.get('Model'),
    number: Number.isSafeInteger(number) ? number : undefined,
    contentHash: values.get('Content-Hash'),
  };
  return { message: values.get('Empty-Message') === 'true' ? '' : text.slice(0, split), trailers };
}
