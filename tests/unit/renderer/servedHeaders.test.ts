// Hardening report, item 16: the browser studio was served with no content security policy and no nosniff.
// The built studio (vite preview: `npm run web` and the browser tests) now gets the desktop app's headers
// (main/csp.ts; the browser tests run the whole studio under them), the dev server all of them but the policy.
import { describe, expect, it } from "vitest";
import config from "../../../renderer/vite.config.ts";
import { contentSecurityPolicy, securityHeaders } from "../../../main/csp.ts";

describe("headers of the browser studio", () => {
  it("serves the built studio with the desktop app's policy and nosniff", () => {
    const headers = config.preview?.headers as Record<string, string>;
    expect(headers).toEqual(securityHeaders());
    expect(headers["Content-Security-Policy"]).toBe(contentSecurityPolicy());
    expect(headers["X-Content-Type-Options"]).toBe("nosniff");
  });

  it("sends nosniff from the dev server too", () => {
    expect((config.server?.headers as Record<string, string>)["X-Content-Type-Options"]).toBe("nosniff");
  });
});
