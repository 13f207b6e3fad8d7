// The browser tests' static server: right files and types, SPA fallback, and nothing outside its root.
import { mkdtemp, mkdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { serveDirectory, type StaticServer } from './static-server.ts';

let dir: string;
let server: StaticServer;

beforeAll(async () => {
  const parent = await mkdtemp(path.join(tmpdir(), 'tenorscope-serve-'));
  dir = path.join(parent, 'site');
  await mkdir(path.join(dir, 'assets'), { recursive: true });
  await writeFile(path.join(dir, 'index.html'), '<!doctype html><title>shell</title>');
  await writeFile(path.join(dir, 'assets', 'app.js'), 'export const x = 1;');
  await writeFile(path.join(parent, 'secret.txt'), 'outside the root');
  server = await serveDirectory(dir);
});

afterAll(async () => {
  await server?.close();
  await rm(path.dirname(dir), { recursive: true, force: true });
});

const get = (p: string, init?: RequestInit) => fetch(new URL(p, server.url), init);

describe('static server', () => {
  it('listens on a loopback port', () => {
    expect(server.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/$/);
  });

  it('serves index.html at / and files with their content type', async () => {
    const home = await get('/');
    expect(home.status).toBe(200);
    expect(home.headers.get('content-type')).toBe('text/html; charset=utf-8');
    expect(await home.text()).toContain('<title>shell</title>');
    const js = await get('/assets/app.js');
    expect(js.status).toBe(200);
    expect(js.headers.get('content-type')).toBe('text/javascript; charset=utf-8');
    expect(await js.text()).toBe('export const x = 1;');
  });

  it('answers an app route with the shell and a missing asset with 404', async () => {
    const route = await get('/curves/usd-sofr');
    expect(route.status).toBe(200);
    expect(await route.text()).toContain('<title>shell</title>');
    expect((await get('/assets/missing.js')).status).toBe(404);
  });

  it('never serves a file outside its root', async () => {
    for (const p of ['/../secret.txt', '/%2e%2e/secret.txt', '/assets/%2e%2e%2f%2e%2e%2fsecret.txt']) {
      const res = await get(p);
      expect(await res.text(), p).not.toContain('outside the root');
    }
  });

  it('refuses methods other than GET and HEAD', async () => {
    expect((await get('/', { method: 'POST', body: 'x' })).status).toBe(405);
    const head = await get('/', { method: 'HEAD' });
    expect(head.status).toBe(200);
    expect(await head.text()).toBe('');
  });
});
