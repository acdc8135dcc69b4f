// A bare file server for a built app, for the benches that time pages in Chromium without the API: files from
// `root` (index.html for any other path, as the app's own routing wants), and a signed-out answer for /api/me.
import { readFile } from 'node:fs/promises';
import { createServer, type Server } from 'node:http';
import { extname, join, normalize } from 'node:path';

const contentTypes: Record<string, string> = {
  '.html': 'text/html',
  '.js': 'text/javascript',
  '.css': 'text/css',
  '.svg': 'image/svg+xml',
  '.woff2': 'font/woff2',
};

/** Listens on a free loopback port; read it from `address()`. */
export function serveBuiltApp(root: string): Server {
  return createServer(async (request, response) => {
    const path = decodeURIComponent(new URL(request.url ?? '/', 'http://bench').pathname);
    if (path.startsWith('/api/')) {
      response.setHeader('content-type', 'application/json');
      response.end(
        path === '/api/me' ? '{"user":null}' : '{"error":{"code":"not_found","message":"none"}}',
      );
      return;
    }
    const file = join(root, normalize(path));
    const body = await readFile(file).catch(() => null);
    response.setHeader(
      'content-type',
      body ? (contentTypes[extname(file)] ?? 'application/octet-stream') : 'text/html',
    );
    response.end(body ?? (await readFile(join(root, 'index.html'))));
  }).listen(0, '127.0.0.1');
}
