// A tiny static file server for the browser tests: serves a built folder (dist/) on a free
// loopback port. Paths without a file extension fall back to index.html, as the app's routes do.
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import { readFile, stat } from 'node:fs/promises';
import type { AddressInfo } from 'node:net';
import path from 'node:path';

export interface StaticServer {
  /** Origin with a trailing slash, e.g. http://127.0.0.1:40123/ */
  readonly url: string;
  close(): Promise<void>;
}

const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.map': 'application/json; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.jpg': 'image/jpeg',
  '.ico': 'image/x-icon',
  '.txt': 'text/plain; charset=utf-8',
  '.csv': 'text/csv; charset=utf-8',
  '.woff2': 'font/woff2',
  '.wasm': 'application/wasm',
};

async function isFile(file: string): Promise<boolean> {
  try {
    return (await stat(file)).isFile();
  } catch {
    return false;
  }
}

export function send(res: ServerResponse, status: number, type: string, body: string | Buffer, head = false): void {
  res.writeHead(status, {
    'content-type': type,
    'content-length': Buffer.byteLength(body),
    'cache-control': 'no-store',
    'x-content-type-options': 'nosniff',
  });
  res.end(head ? undefined : body);
}

/** Resolves a request path to a file inside root, or null when it is not one. */
async function resolveFile(root: string, rawUrl: string): Promise<string | null> {
  let pathname: string;
  try {
    pathname = decodeURIComponent(new URL(rawUrl, 'http://localhost').pathname);
  } catch {
    return null;
  }
  if (pathname.includes('\0')) return null;
  const target = path.resolve(root, '.' + pathname);
  const rel = path.relative(root, target);
  if (rel.startsWith('..') || path.isAbsolute(rel)) return null;
  if (await isFile(target)) return target;
  const index = path.join(target, 'index.html');
  if (await isFile(index)) return index;
  // A client-side route (no extension) gets the app shell; a missing asset is a 404.
  if (path.extname(pathname) === '') {
    const shell = path.join(root, 'index.html');
    if (await isFile(shell)) return shell;
  }
  return null;
}

export interface ServeOptions {
  /** Answers a request before the files do (the benchmark's probe routes); returns true when it has. */
  readonly intercept?: (url: URL, res: ServerResponse) => boolean;
  /** Rewrites an HTML file as it is served (the benchmark puts its probe script into index.html). */
  readonly rewriteHtml?: (html: string) => string;
}

/** Serves `root` on 127.0.0.1 at a free port until close() is called. */
export async function serveDirectory(root: string, options: ServeOptions = {}): Promise<StaticServer> {
  const absRoot = path.resolve(root);
  const server = createServer((req: IncomingMessage, res: ServerResponse) => {
    const head = req.method === 'HEAD';
    if (req.method !== 'GET' && !head) {
      send(res, 405, 'text/plain; charset=utf-8', 'method not allowed\n', head);
      return;
    }
    if (options.intercept?.(new URL(req.url ?? '/', 'http://localhost'), res)) return;
    resolveFile(absRoot, req.url ?? '/')
      .then(async (file) => {
        if (file === null) {
          send(res, 404, 'text/plain; charset=utf-8', 'not found\n', head);
          return;
        }
        const ext = path.extname(file).toLowerCase();
        const type = TYPES[ext] ?? 'application/octet-stream';
        const body = await readFile(file);
        send(res, 200, type, ext === '.html' && options.rewriteHtml ? options.rewriteHtml(body.toString('utf8')) : body, head);
      })
      .catch((error: unknown) => {
        send(res, 500, 'text/plain; charset=utf-8', `server error: ${String(error)}\n`, head);
      });
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      server.off('error', reject);
      resolve();
    });
  });
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}/`,
    close: () =>
      new Promise<void>((resolve, reject) => {
        server.closeAllConnections();
        server.close((error) => (error ? reject(error) : resolve()));
      }),
  };
}
