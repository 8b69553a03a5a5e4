// The Content-Security-Policy the studio runs under (directive syntax: W3C CSP Level 3;
// required sources: the project brief's security rules).
import { describe, expect, it } from "vitest";
import { CSP_DIRECTIVES, contentSecurityPolicy, securityHeaders } from "../../../main/csp.ts";

function parse(policy: string): Map<string, string[]> {
  return new Map(
    policy
      .split(";")
      .map((d) => d.trim().split(/\s+/))
      .filter((parts) => parts[0])
      .map(([name, ...sources]) => [name, sources]),
  );
}

describe("content security policy", () => {
  const policy = parse(contentSecurityPolicy());

  it("loads scripts only from the app itself (no inline script, no eval)", () => {
    const script = policy.get("script-src")!;
    expect(script).toContain("'self'");
    expect(script).not.toContain("'unsafe-inline'");
    expect(script).not.toContain("'unsafe-eval'");
    expect(script.every((s) => s === "'self'" || s === "'wasm-unsafe-eval'")).toBe(true);
  });

  it("allows workers from the app and from blobs, styles inline for React, images from data and blob", () => {
    expect(policy.get("worker-src")).toEqual(["'self'", "blob:"]);
    expect(policy.get("style-src")).toEqual(["'self'", "'unsafe-inline'"]);
    expect(policy.get("img-src")).toEqual(["'self'", "data:", "blob:"]);
  });

  it("fetches nothing remote and embeds no plugins or frames", () => {
    expect(policy.get("connect-src")).toEqual(["'self'"]);
    expect(policy.get("object-src")).toEqual(["'none'"]);
    expect(policy.get("frame-src")).toEqual(["'none'"]);
    for (const sources of policy.values()) for (const s of sources) expect(s).not.toMatch(/^(https?:|\*|ws:)/);
  });

  it("serialises every directive once", () => {
    expect(policy.size).toBe(Object.keys(CSP_DIRECTIVES).length);
    expect(securityHeaders()["Content-Security-Policy"]).toBe(contentSecurityPolicy());
  });
});
