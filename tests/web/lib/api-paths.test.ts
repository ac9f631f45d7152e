import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import ts from 'typescript';
import { paths } from '@web/lib/api-paths';

const ROOT = join(import.meta.dirname, '../../..');
const WEB = join(ROOT, 'web');
const PATHS_MODULE = 'web/lib/api-paths.ts';
// A string or template piece that begins an API path, or carries one after a host.
const API_PATH = /(^|[^\w.-])\/api(\/|\?|$)/;

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(path);
    return /\.(ts|tsx)$/.test(entry.name) ? [path] : [];
  });
}

/** The string and template literals of a file (comments are not read). */
function apiPathLiterals(file: string, text = readFileSync(file, 'utf8')): string[] {
  const source = ts.createSourceFile(file, text, ts.ScriptTarget.Latest, true, ts.ScriptKind.TSX);
  const found: string[] = [];
  const visit = (node: ts.Node) => {
    if (
      (ts.isStringLiteral(node) ||
        ts.isNoSubstitutionTemplateLiteral(node) ||
        ts.isTemplateHead(node) ||
        ts.isTemplateMiddle(node) ||
        ts.isTemplateTail(node)) &&
      API_PATH.test(node.text)
    ) {
      const { line } = source.getLineAndCharacterOfPosition(node.getStart());
      found.push(`${relative(ROOT, file)}:${line + 1}: ${node.getText()}`);
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
  return found;
}

describe('the client API paths', () => {
  it('are written only in web/lib/api-paths.ts', () => {
    const files = sourceFiles(WEB).filter((file) => relative(ROOT, file) !== PATHS_MODULE);
    expect(files.length).toBeGreaterThan(20);
    expect(files.flatMap((file) => apiPathLiterals(file))).toEqual([]);
  });

  it('the scan finds a path written as a string, a template or a link, and skips comments', () => {
    const scratch = [
      '// GET /api/me answers the account',
      "const me = api.get('/api/me');",
      'const model = api.get(`/api/models/${id}/revisions?limit=${limit}`);',
      'const link = <a href="/api/revisions/1?format=yaml">YAML</a>;',
    ].join('\n');
    expect(apiPathLiterals('web/scratch.tsx', scratch)).toEqual([
      "web/scratch.tsx:2: '/api/me'",
      'web/scratch.tsx:3: `/api/models/${',
      'web/scratch.tsx:4: "/api/revisions/1?format=yaml"',
    ]);
  });

  it('encode every id and name that goes into a path', () => {
    expect(paths.revisionTag('r 1', 'maiden/2')).toBe('/api/revisions/r%201/tags/maiden%2F2');
    expect(paths.workspaceMember('ws?', 'u#1')).toBe('/api/workspaces/ws%3F/members/u%231');
    expect(paths.modelRevisionNumber('m', 7)).toBe('/api/models/m/revisions/7');
  });

  it('send the query values given and leave out the undefined ones', () => {
    expect(paths.modelRevisions('m', { limit: 50, before: undefined })).toBe('/api/models/m/revisions?limit=50');
    expect(paths.workspaceReceivers('w', { q: 'a&b', status: null })).toBe('/api/workspaces/w/receivers?q=a%26b');
    expect(paths.revision('r', { format: 'yaml', download: 1 })).toBe('/api/revisions/r?format=yaml&download=1');
    expect(paths.workspaceModels('w', {})).toBe('/api/workspaces/w/models');
  });
});
