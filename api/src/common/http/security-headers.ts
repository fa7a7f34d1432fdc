import type { NextFunction, Request, RequestHandler, Response } from 'express';
import helmet from 'helmet';

/**
 * Response headers for the app and the API (helmet). The built UI runs under this policy: Vite
 * emits no inline script, the fonts are bundled (no CDN), and Fluent UI writes its styles through
 * the CSSOM, which style-src does not govern. The API's own documentation page (Swagger UI) needs
 * inline styles and images from data: URLs; it gets its own, slightly wider policy.
 */
export function securityHeaders(options: { hstsMaxAgeSeconds: number; docsPath: string }): RequestHandler {
  const common = {
    // The token sits in localStorage: a framing site or a leaked referrer must not reach it.
    frameguard: { action: 'deny' as const },
    referrerPolicy: { policy: 'no-referrer' as const },
    // Off unless the deployment is behind TLS: HSTS on plain http://127.0.0.1 would only confuse.
    strictTransportSecurity: options.hstsMaxAgeSeconds > 0 ? { maxAge: options.hstsMaxAgeSeconds, includeSubDomains: true } : false,
    crossOriginEmbedderPolicy: false,
  };
  // Fluent's style engine adds <style> elements at run time; they carry this response's nonce.
  const styleNonce = (_request: unknown, response: unknown) => `'nonce-${String((response as Response).locals.cspNonce ?? '')}'`;
  const appDirectives = {
    defaultSrc: ["'self'"],
    scriptSrc: ["'self'"],
    styleSrc: ["'self'", styleNonce],
    fontSrc: ["'self'"],
    imgSrc: ["'self'", 'data:'],
    connectSrc: ["'self'"],
    objectSrc: ["'none'"],
    baseUri: ["'self'"],
    formAction: ["'self'"],
    frameAncestors: ["'none'"],
    // the app is served over http on loopback; upgrading would break it there
    upgradeInsecureRequests: null,
  };
  const app = helmet({ ...common, contentSecurityPolicy: { useDefaults: false, directives: appDirectives } });
  const docs = helmet({
    ...common,
    contentSecurityPolicy: { useDefaults: false, directives: { ...appDirectives, styleSrc: ["'self'", "'unsafe-inline'"] } },
  });
  const permissionsPolicy = 'camera=(), microphone=(), geolocation=(), payment=(), usb=()';
  return (request: Request, response: Response, next: NextFunction) => {
    response.setHeader('Permissions-Policy', permissionsPolicy);
    const handler = request.path === options.docsPath || request.path.startsWith(`${options.docsPath}/`) ? docs : app;
    handler(request, response, next);
  };
}

/** Signed-in answers must not linger in a browser or proxy cache once the user signs out. */
export function noStoreForApi(apiPrefix: string): RequestHandler {
  const prefix = `/${apiPrefix}`;
  return (request: Request, response: Response, next: NextFunction) => {
    if (request.path === prefix || request.path.startsWith(`${prefix}/`)) response.setHeader('Cache-Control', 'no-store');
    next();
  };
}
