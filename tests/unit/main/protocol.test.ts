// The app protocol that serves out/renderer: traversal refused, right MIME types, CSP on every
// response. MIME types: IANA media types registry (text/html, text/css, image/svg+xml,
// image/png), RFC 9239 (text/javascript), WebAssembly JS API spec (application/wasm, required
// for streaming compilation).
import { describe, expect, it, vi } from "vitest";
import { mkdirSync, writeFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { APP_ENTRY_URL, APP_ORIGIN, APP_SCHEME, createAppProtocolHandler, mimeTypeFor, registerAppScheme, resolveAppRequest } from "../../../main/protocol.ts";
import { useTempDir } from "./tempDir.ts";

const newDir = useTempDir();
const root = resolve("/srv/islet/out/renderer");

describe("app URL to file", () => {
  it("maps the entry URL and the bare origin to index.html", () => {
    expect(resolveAppRequest(root, APP_ENTRY_URL)).toEqual({ ok: true, path: join(root, "index.html") });
    expect(resolveAppRequest(root, `${APP_ORIGIN}/`)).toEqual({ ok: true, path: join(root, "index.html") });
  });

  it("maps nested assets and decodes escapes", () => {
    expect(resolveAppRequest(root, `${APP_ORIGIN}/assets/worker-abc.js?v=1#x`)).toEqual({ ok: true, path: join(root, "assets", "worker-abc.js") });
    expect(resolveAppRequest(root, `${APP_ORIGIN}/demo/dairy%20coop.islet`)).toEqual({ ok: true, path: join(root, "demo", "dairy coop.islet") });
  });

  it.each([
    ["encoded dot segments", `${APP_ORIGIN}/assets/..%2f..%2f..%2fetc/passwd`],
    ["encoded slash", `${APP_ORIGIN}/%2e%2e%2fsecret`],
    ["encoded backslash", `${APP_ORIGIN}/..%5c..%5csecret`],
    ["literal backslash", `${APP_ORIGIN}/..\\..\\secret`],
    ["NUL byte", `${APP_ORIGIN}/index.html%00.png`],
  ])("refuses path traversal: %s", (_label, url) => {
    const r = resolveAppRequest(root, url);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.status).toBe(403);
  });

  it("never resolves outside the root, even after URL normalisation of plain dot segments", () => {
    // WHATWG URL parsing removes "/../" before the handler sees it; the result must stay inside.
    const r = resolveAppRequest(root, `${APP_ORIGIN}/../../etc/passwd`);
    if (r.ok) expect(r.path.startsWith(root + "/") || r.path.startsWith(root + "\\")).toBe(true);
  });

  it("refuses other schemes and hosts", () => {
    expect(resolveAppRequest(root, "file:///etc/passwd")).toMatchObject({ ok: false, status: 404 });
    expect(resolveAppRequest(root, `${APP_SCHEME}://elsewhere/index.html`)).toMatchObject({ ok: false, status: 404 });
    expect(resolveAppRequest(root, "not a url")).toMatchObject({ ok: false, status: 400 });
  });
});

describe("MIME types", () => {
  it.each([
    ["index.html", "text/html; charset=utf-8"],
    ["assets/app.js", "text/javascript; charset=utf-8"],
    ["assets/worker.mjs", "text/javascript; charset=utf-8"],
    ["assets/app.css", "text/css; charset=utf-8"],
    ["assets/solver.wasm", "application/wasm"],
    ["assets/icon.svg", "image/svg+xml"],
    ["assets/icon.PNG", "image/png"],
    ["demo/dairy-coop.islet", "application/json; charset=utf-8"],
    ["assets/blob.xyz", "application/octet-stream"],
  ])("%s is served as %s", (path, mime) => {
    expect(mimeTypeFor(path)).toBe(mime);
  });
});

describe("protocol handler", () => {
  function builtRenderer() {
    const dir = newDir();
    mkdirSync(join(dir, "assets"));
    writeFileSync(join(dir, "index.html"), "<!doctype html><title>t</title>");
    writeFileSync(join(dir, "assets", "app.js"), "console.log(1)");
    return dir;
  }

  it("serves a file with its MIME type and the Content-Security-Policy", async () => {
    const handler = createAppProtocolHandler(builtRenderer());
    const res = await handler(new Request(`${APP_ORIGIN}/assets/app.js`));
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("text/javascript; charset=utf-8");
    expect(res.headers.get("content-security-policy")).toContain("script-src 'self'");
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect(await res.text()).toBe("console.log(1)");
  });

  it("answers 404 for a missing file and 403 for traversal without reading anything", async () => {
    const read = vi.fn(async () => new Uint8Array());
    const handler = createAppProtocolHandler(builtRenderer(), read);
    expect((await handler(new Request(`${APP_ORIGIN}/..%2f..%2fsecret.txt`))).status).toBe(403);
    expect(read).not.toHaveBeenCalled();
    const real = createAppProtocolHandler(builtRenderer());
    expect((await real(new Request(`${APP_ORIGIN}/nope.js`))).status).toBe(404);
  });

  it("refuses methods other than GET and HEAD", async () => {
    const handler = createAppProtocolHandler(builtRenderer());
    expect((await handler(new Request(APP_ENTRY_URL, { method: "POST", body: "x" }))).status).toBe(405);
  });
});

describe("scheme registration", () => {
  it("registers islet-app as standard, secure and fetch-capable so module workers load", () => {
    const registerSchemesAsPrivileged = vi.fn();
    registerAppScheme({ registerSchemesAsPrivileged });
    const [[schemes]] = registerSchemesAsPrivileged.mock.calls;
    expect(schemes).toHaveLength(1);
    expect(schemes[0].scheme).toBe("islet-app");
    expect(schemes[0].privileges).toMatchObject({ standard: true, secure: true, supportFetchAPI: true });
  });
});
