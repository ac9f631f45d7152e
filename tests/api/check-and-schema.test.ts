import { readFileSync } from 'node:fs';
import Ajv2020 from 'ajv/dist/2020';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { analyzeSetup } from '@shared/analyze';
import { useTestApp } from './helpers/test-app';

const t = useTestApp();
const read = (file: string) => readFileSync(new URL(`../../${file}`, import.meta.url), 'utf8');
const fixture = (name: string) => read(`fixtures/${name}`);
const trainer = fixture('valid/trainer-single-receiver.yaml');

describe('POST /api/check', () => {
  it('checks YAML sent as application/yaml without a session, answering what the shared analyzer finds', async () => {
    const response = await request(t.app)
      .post('/api/check')
      .set('Content-Type', 'application/yaml')
      .send(trainer)
      .expect(200);
    const expected = analyzeSetup(trainer);
    expect(response.body.data).toEqual({
      readable: true,
      findings: expected.findings,
      errors: expected.counts.errors,
      warnings: expected.counts.warnings,
      infos: expected.counts.infos,
    });
    expect(response.body.data.errors).toBe(0);
  });

  it('accepts text/plain and JSON { yaml } alike', async () => {
    const plain = await request(t.app).post('/api/check').set('Content-Type', 'text/plain').send(trainer).expect(200);
    const json = await request(t.app).post('/api/check').send({ yaml: trainer }).expect(200);
    expect(json.body).toEqual(plain.body);
  });

  it('answers unreadable YAML with 200 and a syntax finding that has a line and column', async () => {
    const response = await request(t.app)
      .post('/api/check')
      .set('Content-Type', 'application/yaml')
      .send('format: bindery-setup/1\nchannels: [\n')
      .expect(200);
    expect(response.body.data.readable).toBe(false);
    expect(response.body.data.errors).toBeGreaterThan(0);
    expect(response.body.data.findings[0]).toMatchObject({
      rule: 'syntax',
      severity: 'error',
      line: expect.any(Number),
      column: expect.any(Number),
    });
  });

  it('refuses a text past the size limit with 413', async () => {
    const response = await request(t.app)
      .post('/api/check')
      .set('Content-Type', 'application/yaml')
      .send(`# ${'x'.repeat(520 * 1024)}\n`)
      .expect(413);
    expect(response.body.error.code).toBe('too-large');
  });

  it('asks for a body when there is none, and refuses other types with 415', async () => {
    expect((await request(t.app).post('/api/check').expect(400)).body.error.code).toBe('missing-body');
    expect(
      (await request(t.app).post('/api/check').set('Content-Type', 'application/xml').send('<a/>').expect(415)).body
        .error.code,
    ).toBe('unsupported-media-type');
    const wrongJson = await request(t.app).post('/api/check').send({ text: trainer }).expect(400);
    expect(wrongJson.body.error.details.fields.yaml).toBeDefined();
  });
});

describe('GET /api/schema/setup-1.json', () => {
  it('publishes the schema file, which accepts the valid fixtures', async () => {
    const response = await request(t.app).get('/api/schema/setup-1.json').expect(200);
    expect(response.headers['content-type']).toMatch(/^application\/schema\+json/);
    const schema = JSON.parse(response.text);
    expect(schema).toEqual(JSON.parse(read('shared/format/setup-1.schema.json')));
    const validate = new Ajv2020({ strict: false }).compile(schema);
    for (const name of ['valid/trainer-single-receiver.yaml', 'valid/scale-16-channel-two-receivers.yaml']) {
      expect(validate(parse(fixture(name))), name).toBe(true);
    }
  });
});
