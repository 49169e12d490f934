import express from 'express';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import { get, type IncomingMessage } from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { createWebHosting } from './web-hosting';

let dist: string;
let app: express.Express;
const bundle = `export const greeting = ${JSON.stringify('charge '.repeat(2000))};\n`;

beforeAll(async () => {
  dist = mkdtempSync(join(tmpdir(), 'cw-dist-'));
  mkdirSync(join(dist, 'media'));
  writeFileSync(
    join(dist, 'index.html'),
    `<!doctype html><title>Cellwarden</title>${'<p>x</p>'.repeat(200)}`,
  );
  writeFileSync(join(dist, 'main-AB12CD34.js'), bundle);
  writeFileSync(join(dist, 'media', 'roboto-latin-400-normal-Xy9_ab12.woff2'), Buffer.alloc(64, 7));
  writeFileSync(join(dist, 'favicon.ico'), Buffer.alloc(32, 1));
  const hosting = createWebHosting(dist)!;
  await hosting.ready;
  app = express().use(hosting);
});
afterAll(() => rmSync(dist, { recursive: true, force: true }));

/** The raw bytes and headers, without a client that decompresses on its own. */
async function fetchRaw(path: string, acceptEncoding: string) {
  const server = app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  const { port } = server.address() as AddressInfo;
  return new Promise<{ headers: IncomingMessage['headers']; body: Buffer }>((resolve, reject) => {
    get({ host: '127.0.0.1', port, path, headers: { 'Accept-Encoding': acceptEncoding } }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => resolve({ headers: res.headers, body: Buffer.concat(chunks) }));
    }).on('error', reject);
  }).finally(() => server.close());
}

it('sends a bundle brotli-compressed to a browser that accepts it, cached for a year', async () => {
  const res = await fetchRaw('/main-AB12CD34.js', 'gzip, deflate, br, zstd');
  expect(res.headers['content-encoding']).toBe('br');
  expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
  expect(res.headers['content-type']).toMatch(/javascript/);
  expect(res.headers.vary).toMatch(/Accept-Encoding/);
  expect(brotliDecompressSync(res.body).toString()).toBe(bundle);
  expect(res.body.length).toBeLessThan(bundle.length / 10);
});

it('sends gzip to a client that accepts only gzip, and the plain file to one that accepts neither', async () => {
  const gzipped = await fetchRaw('/main-AB12CD34.js', 'gzip');
  expect(gzipped.headers['content-encoding']).toBe('gzip');
  expect(gunzipSync(gzipped.body).toString()).toBe(bundle);
  const plain = await fetchRaw('/main-AB12CD34.js', 'identity');
  expect(plain.headers['content-encoding']).toBeUndefined();
  expect(plain.body.toString()).toBe(bundle);
  expect(plain.headers['cache-control']).toBe('public, max-age=31536000, immutable');
});

it('has index.html checked on every load, for the file and for client-side routes', async () => {
  for (const path of ['/', '/systems/abc/history', '/index.html']) {
    const res = await request(app).get(path).set('Accept-Encoding', 'br');
    expect({ path, cache: res.headers['cache-control'] }).toEqual({ path, cache: 'no-cache' });
  }
});

it('caches a hashed font for a year and an unhashed icon for an hour, neither recompressed', async () => {
  const font = await request(app)
    .get('/media/roboto-latin-400-normal-Xy9_ab12.woff2')
    .set('Accept-Encoding', 'br');
  expect(font.headers['cache-control']).toBe('public, max-age=31536000, immutable');
  expect(font.headers['content-encoding']).toBeUndefined();
  const icon = await request(app).get('/favicon.ico').set('Accept-Encoding', 'identity');
  expect(icon.headers['cache-control']).toBe('public, max-age=3600');
});

it('leaves API paths to the API', async () => {
  const res = await request(app).get('/api/systems');
  expect(res.status).toBe(404);
});
