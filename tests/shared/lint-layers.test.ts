import { randomUUID } from 'node:crypto';
import { rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { ESLint } from 'eslint';
import tseslint from 'typescript-eslint';
import { afterEach, describe, expect, it } from 'vitest';

// The layers of DEVELOPERS.md are lint rules: a wrong-way import in a scratch file is
// caught. The probes skip type information (not what is tested) so this stays quick.
const root = path.resolve(__dirname, '../..');
const probes: string[] = [];

async function lintProbe(folder: string, source: string): Promise<string[]> {
  const file = path.join(root, folder, `lint-probe-${randomUUID()}.ts`);
  probes.push(file);
  writeFileSync(file, source);
  const eslint = new ESLint({
    cwd: root,
    overrideConfig: [{ files: ['**/lint-probe-*.ts'], ...tseslint.configs.disableTypeChecked }],
  });
  const [result] = await eslint.lintFiles([file]);
  return result.messages.map((message) => `${message.ruleId}: ${message.message}`);
}

afterEach(() => {
  for (const file of probes.splice(0)) rmSync(file, { force: true });
});

describe('the layer rules', () => {
  it('refuse shared code that imports the API', async () => {
    const messages = await lintProbe('shared', "export { createApp } from '../api/app';\n");
    expect(messages.join('\n')).toMatch(/import-x\/no-restricted-paths: .*shared\/ is pure code/);
  });

  it('refuse the client importing the server', async () => {
    const messages = await lintProbe('web/lib', "export type { AppConfig } from '@api/config';\n");
    expect(messages.join('\n')).toMatch(/import-x\/no-restricted-paths: .*talks to the API over HTTP/);
  });

  it('refuse a model that calls up into a command', async () => {
    const messages = await lintProbe('api/models', "export { saveRevision } from '../commands/save-revision';\n");
    expect(messages.join('\n')).toMatch(/import-x\/no-restricted-paths: .*Models are the bottom layer/);
  });

  it('refuse a policy that reads the request or the database', async () => {
    const messages = await lintProbe(
      'api/policies',
      "export type { Request } from 'express';\nexport { Membership } from '../models';\n",
    );
    expect(messages.join('\n')).toMatch(/no-restricted-imports: .*Policies are pure/);
    expect(messages.join('\n')).toMatch(/import-x\/no-restricted-paths: .*Policies are pure decisions/);
  });

  it('refuse a query that imports a command, and portability that imports a route', async () => {
    const query = await lintProbe('api/queries', "export { saveRevision } from '../commands/save-revision';\n");
    expect(query.join('\n')).toMatch(/import-x\/no-restricted-paths: .*Queries read/);
    const portability = await lintProbe('api/portability', "export { modelsRouter } from '../routes/models';\n");
    expect(portability.join('\n')).toMatch(/import-x\/no-restricted-paths: .*Portability is called by routes/);
  });

  it('refuse a model that imports a policy', async () => {
    const messages = await lintProbe('api/models', "export { modelPolicy } from '../policies/model';\n");
    expect(messages.join('\n')).toMatch(/import-x\/no-restricted-paths: .*Models are the bottom layer/);
  });

  it('let a route use a command, as it should', async () => {
    const messages = await lintProbe('api/routes', "export { saveRevision } from '../commands/save-revision';\n");
    expect(messages.filter((message) => message.startsWith('import-x/'))).toEqual([]);
  });
});
