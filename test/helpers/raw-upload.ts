import http from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Express } from 'express';

/** The app listening on a free loopback port, for requests supertest cannot make (a client that hangs up). */
export async function listenOnLoopback(app: Express): Promise<{ port: number; close(): Promise<void> }> {
  const server = app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    port,
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}

/** A client that sent a whole multipart `file` upload and has not hung up yet. */
export interface SentUpload {
  /** Closes the connection without waiting for the answer (a tab closed, a laptop lid shut). */
  hangUp(): void;
}

/** Sends one complete multipart upload of `file` as field `file`; resolves once every byte is written. */
export async function sendWholeFile(port: number, urlPath: string, token: string, file: Buffer, fileName: string): Promise<SentUpload> {
  const boundary = 'isallo-raw-upload-boundary';
  const body = Buffer.concat([
    Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${fileName}"\r\nContent-Type: application/octet-stream\r\n\r\n`),
    file,
    Buffer.from(`\r\n--${boundary}--\r\n`),
  ]);
  const req = http.request({
    host: '127.0.0.1',
    port,
    method: 'POST',
    path: urlPath,
    headers: { Authorization: `Bearer ${token}`, 'Content-Type': `multipart/form-data; boundary=${boundary}`, 'Content-Length': String(body.length) },
  });
  // The answer may never be read; a reset after hanging up is expected.
  req.on('error', () => undefined);
  await new Promise<void>((resolve) => req.end(body, () => resolve()));
  return { hangUp: () => req.destroy() };
}
