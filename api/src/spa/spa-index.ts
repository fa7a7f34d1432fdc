import { randomBytes } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { API_PATH_PATTERN } from './ui-dist.js';

/** The placeholder the ui build writes wherever a nonce belongs (ui/vite.config.ts, html.cspNonce). */
export const CSP_NONCE_PLACEHOLDER = 'BEAMWRIGHT_CSP_NONCE';

/** A fresh nonce per response, for the CSP header and the page alike (res.locals.cspNonce). */
export function assignCspNonce(): RequestHandler {
  return (_request: Request, response: Response, next: NextFunction) => {
    response.locals.cspNonce = randomBytes(16).toString('base64');
    next();
  };
}

/** A page route of the single-page app (not the API, not a file such as /assets/x.js). */
function isPageRequest(request: Request): boolean {
  if (request.method !== 'GET' && request.method !== 'HEAD') return false;
  if (API_PATH_PATTERN.test(request.path)) return false;
  return request.path === '/index.html' || !/\.[a-z0-9]+$/i.test(request.path);
}

/**
 * Serves the built index.html for every page route (the SPA's history fallback), with this
 * response's nonce in place of the placeholder so Fluent's <style> elements pass the CSP. The file
 * is read once: it changes only with a new build, which means a restart.
 */
export function serveSpaIndex(uiDistDir: string): RequestHandler {
  const indexPath = join(uiDistDir, 'index.html');
  const template = existsSync(indexPath) ? readFileSync(indexPath, 'utf8') : undefined;
  return (request: Request, response: Response, next: NextFunction) => {
    if (!template || !isPageRequest(request)) return next();
    const nonce = String(response.locals.cspNonce ?? '');
    response.setHeader('Cache-Control', 'no-store');
    response.type('html').send(template.replaceAll(CSP_NONCE_PLACEHOLDER, nonce));
  };
}
