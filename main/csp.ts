// The studio's Content-Security-Policy and response headers: defined in src/model/contentSecurity.ts, which the
// browser studio's server config shares (renderer/ may not import main/).
export { CSP_DIRECTIVES, contentSecurityPolicy, securityHeaders } from "../src/model/contentSecurity.ts";
