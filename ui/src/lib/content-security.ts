// Settings that let the built app run under the server's Content-Security-Policy.
import '@/lib/zod-config';
import { createDOMRenderer, type GriffelRenderer } from '@fluentui/react-components';

/**
 * The per-response nonce the server writes into index.html (Vite's `html.cspNonce` placeholder).
 * The browser hides the attribute after parsing; the `nonce` property keeps it.
 */
export function readCspNonce(doc: Document = document): string | undefined {
  const meta = doc.querySelector<HTMLMetaElement>('meta[property="csp-nonce"]');
  const nonce = meta?.nonce || meta?.getAttribute('nonce') || undefined;
  // the unreplaced placeholder (dev server, tests) is no nonce at all
  return nonce && !nonce.startsWith('BEAMWRIGHT_') ? nonce : undefined;
}

/** Fluent's style engine inserts <style> elements: they carry the nonce so `style-src` admits them. */
export function createStyleRenderer(doc: Document = document): GriffelRenderer {
  const nonce = readCspNonce(doc);
  return createDOMRenderer(doc, nonce ? { styleElementAttributes: { nonce } } : {});
}
