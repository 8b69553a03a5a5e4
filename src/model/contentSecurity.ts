// The studio's Content-Security-Policy and the other response headers, served by the desktop app's protocol
// (main/protocol.ts) and by vite preview for the browser studio (renderer/vite.config.ts): kept in the core, as the
// host contract is, because main/ and renderer/ must agree on it and neither may import the other.
// Only the app's own origin (islet-app://studio) may
// provide scripts, workers, styles and data; nothing is fetched from the network.
// 'wasm-unsafe-eval' lets the bundled WebAssembly solver compile; it does not allow eval of JS.
// Inline styles are allowed because React renders style attributes.
export const CSP_DIRECTIVES: Readonly<Record<string, readonly string[]>> = {
  "default-src": ["'self'"],
  "script-src": ["'self'", "'wasm-unsafe-eval'"],
  "worker-src": ["'self'", "blob:"],
  "style-src": ["'self'", "'unsafe-inline'"],
  "img-src": ["'self'", "data:", "blob:"],
  "font-src": ["'self'", "data:"],
  "connect-src": ["'self'"],
  "object-src": ["'none'"],
  "frame-src": ["'none'"],
  "frame-ancestors": ["'none'"],
  "base-uri": ["'none'"],
  "form-action": ["'none'"],
};

export function contentSecurityPolicy(): string {
  return Object.entries(CSP_DIRECTIVES)
    .map(([name, sources]) => `${name} ${sources.join(" ")}`)
    .join("; ");
}

/** Headers sent with every file the app protocol serves. */
export function securityHeaders(): Record<string, string> {
  return {
    "Content-Security-Policy": contentSecurityPolicy(),
    "X-Content-Type-Options": "nosniff",
    "Cross-Origin-Opener-Policy": "same-origin",
    "Referrer-Policy": "no-referrer",
  };
}
