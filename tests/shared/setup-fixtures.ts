import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

// Loads the fixtures under fixtures/valid and fixtures/invalid. An invalid fixture is
// named after the check it shows (`<check-id>.yaml`, or `<check-id>--<variant>.yaml`)
// and says in its header where the finding must be: `# expect: <semantic path>`, an
// optional `# also: <rule>, ...` for rules that come with it, and a `# <-` marker on
// the line the finding must point at.

export const FIXTURES_DIR = fileURLToPath(new URL('../../fixtures/', import.meta.url));

export interface ValidFixture {
  name: string;
  file: string;
  text: string;
}

export interface InvalidFixture extends ValidFixture {
  rule: string;
  path: string;
  line: number;
  also: string[];
}

function load(folder: string): ValidFixture[] {
  const dir = `${FIXTURES_DIR}${folder}/`;
  return readdirSync(dir)
    .filter((name) => name.endsWith('.yaml'))
    .sort()
    .map((name) => ({
      name: name.replace(/\.yaml$/, ''),
      file: `${dir}${name}`,
      text: readFileSync(`${dir}${name}`, 'utf8'),
    }));
}

export function validFixtures(): ValidFixture[] {
  return load('valid');
}

export function invalidFixtures(): InvalidFixture[] {
  return load('invalid').map((fixture) => {
    const lines = fixture.text.split('\n');
    const header = (key: string) =>
      lines
        .find((line) => line.startsWith(`# ${key}: `))
        ?.slice(key.length + 4)
        .trim();
    const expect = header('expect');
    if (expect === undefined) throw new Error(`${fixture.name}: no "# expect:" line`);
    const marked = lines.findIndex((line, i) => i > 0 && !line.startsWith('# ') && line.includes('# <-'));
    if (marked < 0) throw new Error(`${fixture.name}: no line marked "# <-"`);
    return {
      ...fixture,
      rule: fixture.name.split('--')[0],
      path: expect === '(no path)' ? '' : expect,
      line: marked + 1,
      also: (header('also') ?? '')
        .split(',')
        .map((rule) => rule.trim())
        .filter(Boolean),
    };
  });
}

export function readFixture(relative: string): string {
  return readFileSync(`${FIXTURES_DIR}${relative}`, 'utf8');
}
