import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { useTestApp } from './helpers/test-app';

const t = useTestApp();
let webDir: string;

beforeAll(() => {
  webDir = mkdtempSync(path.join(os.tmpdir(), 'bindery-web-'));
  mkdirSync(path.join(webDir, 'assets'));
  writeFileSync(path.join(webDir, 'index.html'), '<!doctype html><title>Bindery</title><div id="root"></div>');
  writeFileSync(path.join(webDir, 'assets', 'main-abc123.js'), 'console.log("bindery")');
});

afterAll(() => rmSync(webDir, { recursive: true, force: true }));

describe('security headers', () => {
  it('sends a CSP without inline scripts, and the usual hardening headers', async () => {
    const response = await request(t.app).get('/api/health');
    const csp = response.headers['content-security-policy'];
    expect(csp).toContain("script-src 'self'");
    expect(csp).not.toMatch(/script-src[^;]*unsafe-inline/);
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).not.toContain('upgrade-insecure-requests');
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['referrer-policy']).toBe('no-referrer');
    expect(response.headers['x-powered-by']).toBeUndefined();
  });
});

describe('the error envelope', () => {
  it('answers an unknown API route with a JSON 404', async () => {
    const response = await request(t.app).get('/api/no-such-thing').expect(404);
    expect(response.body).toEqual({
      error: { code: 'no-such-route', message: expect.stringContaining('/api/no-such-thing'), details: {} },
    });
  });

  it('answers a body of an unaccepted type with 415', async () => {
    const response = await request(t.app)
      .post('/api/workspaces')
      .set('Content-Type', 'application/xml')
      .send('<name>x</name>')
      .expect(415);
    expect(response.body.error.code).toBe('unsupported-media-type');
  });

  it('answers a path that cannot be decoded with a 4xx, not a 500', async () => {
    const response = await request(t.app).get('/api/workspaces/%E0%A4%A');
    expect(response.status).toBeGreaterThanOrEqual(400);
    expect(response.status).toBeLessThan(500);
  });
});

describe('serving the built client', () => {
  it('serves index.html for client routes and assets as files, while /api stays JSON', async () => {
    const { app } = t.appWith({ webDir });
    const page = await request(app).get('/w/some-workspace/hangar').expect(200);
    expect(page.headers['content-type']).toMatch(/text\/html/);
    expect(page.text).toContain('<div id="root"></div>');

    const asset = await request(app).get('/assets/main-abc123.js').expect(200);
    expect(asset.headers['cache-control']).toContain('immutable');

    await request(app).get('/assets/missing-000.js').expect(404);
    const api = await request(app).get('/api/nope').expect(404);
    expect(api.body.error.code).toBe('no-such-route');
  });

  it('serves no client when no build folder is configured', async () => {
    await request(t.app).get('/w/some-workspace/hangar').expect(404);
  });
});
