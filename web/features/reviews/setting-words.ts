// A setting named the way a pilot says it ("pin 3 of the wing receiver"), from the
// semantic path a comment is anchored to. The path stays the comment's key; people
// only ever see these words.

const STEPS: { pattern: RegExp; words: (match: RegExpExecArray) => string }[] = [
  { pattern: /^receivers\[id=([^\]]+)\]\.map\[pin=(\d+)\]/, words: (m) => `Pin ${m[2]} of receiver ${m[1]}` },
  { pattern: /^receivers\[id=([^\]]+)\]/, words: (m) => `Receiver ${m[1]}` },
  { pattern: /^channels\[ch=(\d+)\]/, words: (m) => `Channel ${m[1]}` },
  { pattern: /^mixes\[id=([^\]]+)\]/, words: (m) => `Mix ${m[1]}` },
  { pattern: /^controls\[id=([^\]]+)\]/, words: (m) => `Control ${m[1]}` },
  { pattern: /^link\b/, words: () => 'The link' },
  { pattern: /^power\b/, words: () => 'Receiver power' },
  { pattern: /^model\b/, words: () => 'The model block' },
];

/** "Pin 3 of receiver wing", with the field when the path goes deeper ("… · failsafe"). */
export function settingWords(path: string | null): string {
  if (path === null) return 'The whole revision';
  if (path === '') return 'The whole setup';
  for (const { pattern, words } of STEPS) {
    const match = pattern.exec(path);
    if (!match) continue;
    const rest = path.slice(match[0].length).replace(/^\./, '').replace(/_/g, ' ');
    return rest ? `${words(match)} · ${rest}` : words(match);
  }
  return path;
}
