// The Content-Security-Policy of Sightward's pages (set by proxy.ts with a fresh nonce per page;
// API answers get a fixed deny-all policy from next.config.mjs). Next.js puts the nonce on its own
// inline and framework scripts when it finds it in the request's CSP header (Next.js guide
// "Content Security Policy", nonces); 'strict-dynamic' lets those scripts load the page's chunks.
// Styles keep 'unsafe-inline': React style attributes and the calendar's injected <style> carry no
// nonce, and style-src ignores 'unsafe-inline' once a nonce is listed, so none is listed there.

/** A nonce of 128 random bits, base64 (CSP Level 3: at least 128 bits, base64-value). */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  let text = "";
  for (const byte of bytes) text += String.fromCharCode(byte);
  return btoa(text);
}

export function pagePolicy(nonce: string, options: { development?: boolean; tls?: boolean } = {}): string {
  const directives = [
    "default-src 'self'",
    // React in development rebuilds server error stacks with eval; production needs no eval.
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${options.development ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    // FullCalendar ships its icon font as a data: URL.
    "font-src 'self' data:",
    `connect-src 'self'${options.development ? " ws: wss:" : ""}`,
    "worker-src 'self' blob:",
    "manifest-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ];
  if (options.tls) directives.push("upgrade-insecure-requests");
  return directives.join("; ");
}

/** The policy of API answers and anything that is not a page: nothing may load, nothing may frame it. */
export const API_POLICY = "default-src 'none'; frame-ancestors 'none'";
