// The privileged app protocol islet-app://studio/... that serves the built studio from
// out/renderer. Standard + secure gives the pages a real origin, so module workers and fetch
// work (Chromium refuses module scripts from file://). Paths that leave the folder are refused.
import type { Protocol } from "electron";
import { readFile } from "node:fs/promises";
import { extname, isAbsolute, relative, resolve, sep } from "node:path";
import { securityHeaders } from "./csp.ts";

export const APP_SCHEME = "islet-app";
export const APP_HOST = "studio";
export const APP_ORIGIN = `${APP_SCHEME}://${APP_HOST}`;
export const APP_ENTRY_URL = `${APP_ORIGIN}/index.html`;

const MIME_TYPES: Readonly<Record<string, string>> = {
  ".html": "text/html; charset=utf-8",
  ".js": "text/javascript; charset=utf-8",
  ".mjs": "text/javascript; charset=utf-8",
  ".css": "text/css; charset=utf-8",
  ".json": "application/json; charset=utf-8",
  ".islet": "application/json; charset=utf-8",
  ".map": "application/json; charset=utf-8",
  ".wasm": "application/wasm",
  ".svg": "image/svg+xml",
  ".png": "image/png",
  ".jpg": "image/jpeg",
  ".jpeg": "image/jpeg",
  ".webp": "image/webp",
  ".ico": "image/x-icon",
  ".woff": "font/woff",
  ".woff2": "font/woff2",
  ".ttf": "font/ttf",
  ".txt": "text/plain; charset=utf-8",
};

export function mimeTypeFor(path: string): string {
  return MIME_TYPES[extname(path).toLowerCase()] ?? "application/octet-stream";
}

export type ResolvedRequest = { ok: true; path: string } | { ok: false; status: 400 | 403 | 404; reason: string };

/**
 * Maps an app URL to a file below rootDir. Refuses other schemes and hosts, encoded slashes,
 * backslashes, NUL, ".." segments and anything that would resolve outside rootDir.
 */
export function resolveAppRequest(rootDir: string, url: string): ResolvedRequest {
  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    return { ok: false, status: 400, reason: "malformed URL" };
  }
  if (parsed.protocol !== `${APP_SCHEME}:` || parsed.host !== APP_HOST) return { ok: false, status: 404, reason: "unknown origin" };
  const rawPath = parsed.pathname;
  if (/%2f|%5c|%00/i.test(rawPath)) return { ok: false, status: 403, reason: "encoded separator" };
  let decoded: string;
  try {
    decoded = decodeURIComponent(rawPath);
  } catch {
    return { ok: false, status: 400, reason: "malformed escape" };
  }
  if (decoded.includes("\\") || decoded.includes("\0")) return { ok: false, status: 403, reason: "forbidden character" };
  const segments = decoded.split("/").filter((s) => s.length > 0);
  if (segments.some((s) => s === "." || s === "..")) return { ok: false, status: 403, reason: "path traversal" };
  const relativePath = segments.length === 0 ? "index.html" : segments.join("/");
  const root = resolve(rootDir);
  const full = resolve(root, relativePath);
  const rel = relative(root, full);
  if (rel === "" || rel.startsWith("..") || isAbsolute(rel) || !full.startsWith(root + sep)) return { ok: false, status: 403, reason: "path traversal" };
  return { ok: true, path: full };
}

export type ReadFileFn = (path: string) => Promise<Uint8Array>;

/** The protocol handler: a GET on an app URL gives the file with its MIME type and the CSP. */
export function createAppProtocolHandler(rootDir: string, read: ReadFileFn = (p) => readFile(p)): (request: Request) => Promise<Response> {
  return async (request) => {
    const headers = securityHeaders();
    if (request.method !== "GET" && request.method !== "HEAD") {
      return new Response("method not allowed", { status: 405, headers: { ...headers, "Content-Type": "text/plain; charset=utf-8" } });
    }
    const resolved = resolveAppRequest(rootDir, request.url);
    if (!resolved.ok) return new Response(resolved.reason, { status: resolved.status, headers: { ...headers, "Content-Type": "text/plain; charset=utf-8" } });
    let body: Uint8Array;
    try {
      body = await read(resolved.path);
    } catch {
      return new Response("not found", { status: 404, headers: { ...headers, "Content-Type": "text/plain; charset=utf-8" } });
    }
    return new Response(request.method === "HEAD" ? null : (body as Uint8Array<ArrayBuffer>), {
      status: 200,
      headers: { ...headers, "Content-Type": mimeTypeFor(resolved.path), "Cache-Control": "no-cache" },
    });
  };
}

/** Call before app "ready": the scheme's privileges must be known before any window exists. */
export function registerAppScheme(protocol: Pick<Protocol, "registerSchemesAsPrivileged">): void {
  protocol.registerSchemesAsPrivileged([
    { scheme: APP_SCHEME, privileges: { standard: true, secure: true, supportFetchAPI: true, corsEnabled: false, stream: true, codeCache: true } },
  ]);
}

/** Call after "ready", on the session the studio window uses. */
export function serveAppProtocol(protocol: Pick<Protocol, "handle">, rootDir: string): void {
  protocol.handle(APP_SCHEME, createAppProtocolHandler(rootDir));
}
