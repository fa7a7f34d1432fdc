import type { Server } from 'node:http';
import type { NextFunction, Request, Response } from 'express';
import { STATUS_CODES } from 'node:http';

/** The largest JSON body the API reads: a design with its notes is a few kB, so 1 MiB is ample. */
export const MAX_JSON_BODY_BYTES = 1024 * 1024;

export interface RequestTimeouts {
  /** the whole request, headers and body, must arrive within this (a stalled upload is dropped) */
  requestTimeoutMs: number;
  /** the request headers must arrive within this */
  headersTimeoutMs: number;
  /** an idle keep-alive connection is closed after this */
  keepAliveTimeoutMs: number;
}

/** Answers with the API's error shape and closes the connection, so nothing more of the body is read. */
function refuseAndClose(response: Response, statusCode: number, message: string): void {
  if (response.headersSent) {
    response.socket?.destroy();
    return;
  }
  response.setHeader('Connection', 'close');
  response.status(statusCode).json({ statusCode, error: STATUS_CODES[statusCode], message });
  // Once the answer is flushed the socket goes: the client cannot keep streaming a body we refused.
  response.once('finish', () => response.socket?.destroy());
}

/** A route whose bodies may be larger than the JSON limit (an upload); its own route checks the part sizes. */
export interface BodyLimitException {
  method: string;
  /** the request path, exactly (no parameters) */
  path: string;
  maxBytes: number;
}

/**
 * Refuses a body from its declared Content-Length before reading a byte of it. body-parser checks
 * the same header but then drains the whole body before answering, so a client declaring 100 MB
 * would be read to the end first.
 */
export function refuseOversizedBodies(maxBytes: number, larger: readonly BodyLimitException[] = []) {
  return (request: Request, response: Response, next: NextFunction): void => {
    const declared = request.headers['content-length'];
    if (declared !== undefined) {
      const bytes = Number(declared);
      if (!Number.isSafeInteger(bytes) || bytes < 0) {
        refuseAndClose(response, 400, 'Content-Length is not a valid byte count');
        return;
      }
      const limit = larger.find((exception) => exception.method === request.method && exception.path === request.path)?.maxBytes ?? maxBytes;
      if (bytes > limit) {
        refuseAndClose(response, 413, `The request body of ${bytes} bytes is over the limit of ${limit} bytes`);
        return;
      }
    }
    next();
  };
}

/**
 * Drops a request whose body has not fully arrived within `timeoutMs` (a slow or stalled upload
 * holds a connection and a parser). Node's own requestTimeout does the same, but it is only
 * checked every 30 s; this timer fires on time.
 */
export function dropStalledBodies(timeoutMs: number) {
  return (request: Request, response: Response, next: NextFunction): void => {
    const hasBody = request.headers['content-length'] !== undefined || request.headers['transfer-encoding'] !== undefined;
    if (!hasBody || request.readableEnded) {
      next();
      return;
    }
    const timer = setTimeout(() => {
      if (!request.readableEnded) refuseAndClose(response, 408, `The request body did not arrive within ${Math.round(timeoutMs / 1000)} s`);
    }, timeoutMs);
    timer.unref();
    const clear = (): void => clearTimeout(timer);
    request.once('end', clear);
    request.once('close', clear);
    response.once('finish', clear);
    next();
  };
}

/** Server-wide limits: headers, whole request and idle keep-alive connections. */
export function applyServerTimeouts(server: Server, timeouts: RequestTimeouts): void {
  server.headersTimeout = timeouts.headersTimeoutMs;
  server.requestTimeout = timeouts.requestTimeoutMs;
  server.keepAliveTimeout = timeouts.keepAliveTimeoutMs;
}
