import type { Response } from 'express';

/**
 * Sends JSON that is already UTF-8 bytes. For GET and HEAD, Express sets Content-Length, the ETag and a 304 for a
 * fresh request exactly as for the same text, without converting a large string on the request thread. Any other
 * method's answer is never fresh, so it goes out without an ETag (a SHA-1 of the whole body nobody could use).
 */
export function sendJsonBytes(response: Response, body: Buffer): void {
  response.setHeader('Content-Type', 'application/json; charset=utf-8');
  const method = response.req.method;
  if (method === 'GET' || method === 'HEAD') {
    response.send(body);
    return;
  }
  response.setHeader('Content-Length', body.byteLength);
  response.end(body);
}
