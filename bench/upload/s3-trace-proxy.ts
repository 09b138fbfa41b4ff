// A pass-through HTTP proxy in front of the S3 server that logs every request the app makes (method, what it
// names, status, start and end in ms since the epoch, body bytes), for `s3.ts --trace DIR`. It adds a hop, so
// traced runs show where time goes, not how fast anything is.
import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';

/** What an S3 request does, from its method and query (Source: AWS S3 API reference, the operations' request syntax). */
export function s3Operation(method: string, url: string): string {
  const q = new URL(url, 'http://x').searchParams;
  if (q.has('uploadId') && q.has('partNumber')) return `UploadPart ${q.get('partNumber')}`;
  if (method === 'GET' && q.has('uploadId')) return 'ListParts';
  if (method === 'POST' && q.has('uploadId')) return 'CompleteMultipartUpload';
  if (method === 'POST' && q.has('uploads')) return 'CreateMultipartUpload';
  if (method === 'POST' && q.has('delete')) return 'DeleteObjects';
  if (method === 'DELETE' && q.has('uploadId')) return 'AbortMultipartUpload';
  return `${method}Object`;
}

export async function startTraceProxy(target: string, logFile: string): Promise<{ endpoint: string; close: () => Promise<void> }> {
  const to = new URL(target);
  const server = http.createServer((req, res) => {
    const t0 = Date.now();
    let bytes = 0;
    req.on('data', (c: Buffer) => (bytes += c.length));
    const up = http.request({ host: to.hostname, port: to.port, method: req.method, path: req.url, headers: req.headers }, (r) => {
      res.writeHead(r.statusCode ?? 502, r.headers);
      r.pipe(res);
      r.on('end', () => {
        const key = new URL(req.url ?? '/', 'http://x').pathname.split('/').slice(2).join('/');
        fs.appendFileSync(logFile, `${s3Operation(req.method ?? '', req.url ?? '')} ${key} ${r.statusCode} ${t0} ${Date.now()} ${bytes}\n`);
      });
    });
    up.on('error', () => res.destroy());
    req.pipe(up);
  });
  server.keepAliveTimeout = 60_000;
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    endpoint: `http://127.0.0.1:${port}`,
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
