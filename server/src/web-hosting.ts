import express, { type Request, type Response, type Router } from 'express';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { extname, join, relative, resolve, sep } from 'node:path';
import { promisify } from 'node:util';
import { brotliCompress, constants, gzip } from 'node:zlib';

// Text files worth compressing; fonts (woff2) and images are compressed already.
const COMPRESSIBLE = new Set(['.js', '.mjs', '.css', '.html', '.svg', '.json', '.txt', '.map', '.ico']);
// The build names each bundle, stylesheet and font after its content (`chunk-ABCD1234.js`): a changed file
// gets a new name, so the old one may be kept by browsers and proxies for a year without asking again.
const HASHED = /-[A-Za-z0-9_]{8,}\.[a-z0-9]+$/;
const IMMUTABLE = 'public, max-age=31536000, immutable';
// index.html names the current bundles, so it is checked with the server on every load.
const REVALIDATE = 'no-cache';
// The service worker's script and manifest decide which build an installed dashboard runs: never kept stale.
const SERVICE_WORKER_FILES = new Set([
  '/ngsw.json',
  '/ngsw-worker.js',
  '/safety-worker.js',
  '/worker-basic.min.js',
]);

const brotli = promisify(brotliCompress);
const gzipAsync = promisify(gzip);

interface Encoded {
  br?: Buffer;
  gzip?: Buffer;
}

function listFiles(root: string, folder = root): string[] {
  return readdirSync(folder, { withFileTypes: true }).flatMap((entry) => {
    const path = join(folder, entry.name);
    return entry.isDirectory() ? listFiles(root, path) : [path];
  });
}

// Brotli quality 6 compresses the whole dashboard (1.6 MB) in under 0.1 s of CPU and comes within 10 % of
// quality 11, which takes 5 s: on a 2-vCPU node that would compete with a reconnect storm after every restart.
const BROTLI_QUALITY = 6;

/**
 * Compresses every text file of the built dashboard once, in the background (brotli, and gzip for older
 * clients): the bundles never change while the server runs, so no request pays for it.
 */
function precompress(root: string): { encoded: Map<string, Encoded>; ready: Promise<void> } {
  const encoded = new Map<string, Encoded>();
  const work: Promise<unknown>[] = [];
  for (const path of listFiles(root)) {
    if (!COMPRESSIBLE.has(extname(path))) continue;
    const url = '/' + relative(root, path).split(sep).join('/');
    const entry: Encoded = {};
    encoded.set(url, entry);
    const body = readFileSync(path);
    work.push(
      brotli(body, { params: { [constants.BROTLI_PARAM_QUALITY]: BROTLI_QUALITY } }).then(
        (b) => (entry.br = b),
      ),
      gzipAsync(body, { level: 9 }).then((g) => (entry.gzip = g)),
    );
  }
  return { encoded, ready: Promise.all(work).then(() => undefined) };
}

/** Serves the built dashboard, compressed and cached, with index.html for every client-side route. */
export function createWebHosting(distFolder: string): (Router & { ready: Promise<void> }) | undefined {
  const root = resolve(distFolder);
  if (!existsSync(join(root, 'index.html'))) return undefined;
  const { encoded, ready } = precompress(root);
  // Until its compressed copies are ready (a second or two after start) a file is served as it is.
  const router = Object.assign(express.Router(), { ready });

  function sendEncoded(req: Request, res: Response, url: string, cacheControl: string): boolean {
    const entry = encoded.get(url);
    if (!entry) return false;
    // Brotli whenever the browser takes it (every current one does): it is the smaller of the two.
    const accepted = req.acceptsEncodings('br') ? 'br' : req.acceptsEncodings('gzip') ? 'gzip' : undefined;
    const body = accepted === 'br' ? entry.br : accepted === 'gzip' ? entry.gzip : undefined;
    if (!body) return false;
    res.vary('Accept-Encoding');
    res.type(extname(url));
    res.set({ 'Content-Encoding': accepted, 'Cache-Control': cacheControl });
    res.end(req.method === 'HEAD' ? undefined : body);
    return true;
  }

  const cacheControlFor = (url: string) =>
    HASHED.test(url) ? IMMUTABLE : SERVICE_WORKER_FILES.has(url) ? REVALIDATE : 'public, max-age=3600';
  router.use((req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    if (req.path !== '/index.html' && sendEncoded(req, res, req.path, cacheControlFor(req.path))) return;
    next();
  });
  router.use(
    express.static(root, {
      index: false,
      setHeaders: (res, path) => {
        const url = '/' + relative(root, path).split(sep).join('/');
        res.setHeader('Cache-Control', url === '/index.html' ? REVALIDATE : cacheControlFor(url));
        if (COMPRESSIBLE.has(extname(path))) res.vary('Accept-Encoding');
      },
    }),
  );
  router.get(/^(?!\/api\/).*/, (req, res) => {
    if (sendEncoded(req, res, '/index.html', REVALIDATE)) return;
    res.setHeader('Cache-Control', REVALIDATE);
    res.sendFile(join(root, 'index.html'));
  });
  return router;
}
