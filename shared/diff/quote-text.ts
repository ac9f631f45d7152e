// Text a pilot typed (a model's notes, a receiver's label) stands in quotation marks in
// a change sentence, so it does not run into the words around it, and on one line.
// Long text is cut with an ellipsis; when both sides are long and alike, both are shown
// from a little before their first difference, so the cut never hides what changed.

/** Characters of text shown between the quotation marks, ellipses aside. */
export const QUOTE_MAX = 60;
// How much of the shared beginning stays in view before the first difference.
const LEAD = 20;

const oneLine = (value: string): string => value.replace(/\s+/g, ' ').trim();

function excerpt(value: string, start: number): string {
  let shown = value.slice(start);
  if (shown.length > QUOTE_MAX) {
    const space = shown.lastIndexOf(' ', QUOTE_MAX);
    shown = `${shown.slice(0, space > QUOTE_MAX / 2 ? space : QUOTE_MAX).trimEnd()}…`;
  }
  return `“${start > 0 ? '…' : ''}${shown}”`;
}

/** One piece of text, quoted, on one line, cut after about QUOTE_MAX characters. */
export function quoteText(value: string): string {
  return excerpt(oneLine(value), 0);
}

/** Before and after, quoted alike: from the same place, so their difference shows. */
export function quotePair(before: string, after: string): [string, string] {
  const [a, b] = [oneLine(before), oneLine(after)];
  let common = 0;
  while (common < a.length && common < b.length && a[common] === b[common]) common += 1;
  let start = 0;
  if (common > QUOTE_MAX - LEAD) {
    // Begin at the start of a word, about LEAD characters before the difference.
    const space = a.lastIndexOf(' ', common - LEAD);
    start = space > 0 ? space + 1 : common - LEAD;
  }
  return [excerpt(a, start), excerpt(b, start)];
}
