// What `npm start` does about the desktop runtime (Electron), as logic with no I/O of its own: finding the
// runtime, fetching it, and the record of the last failed fetch are passed in (start.mjs gives the real ones,
// tests give stand-ins).
//
// - Runtime present: the desktop app.
// - Missing: one try to fetch it with Electron's own install script, then the desktop app; where that fails, one
//   line saying so and the browser studio. The failure is recorded; for a day after it `npm start` does not try
//   again (it would fail the same way offline or behind the same proxy) unless asked with `--fetch-runtime`.
// - ELECTRON_SKIP_BINARY_DOWNLOAD set: no fetch (the machine asked for none) unless `--fetch-runtime`.

export const FETCH_FLAG = "--fetch-runtime";
/** No new try within this long after a failed one. */
export const RETRY_AFTER_MS = 24 * 60 * 60 * 1000;

/**
 * @typedef {{ at_ms: number, reason: string }} FetchFailure
 * @typedef {{ ok: true } | { ok: false, reason: string, interrupted?: boolean }} FetchOutcome
 * @typedef {{ action: "desktop" } | { action: "fetch" } | { action: "browser", why: "recent-failure" | "skip-env" }} Decision
 */

/**
 * The decision before any fetch.
 * @param {{ present: boolean, forceFetch: boolean, skipDownloadEnv: boolean, lastFailure: FetchFailure | null, now_ms: number }} s
 * @returns {Decision}
 */
export function decideRuntime(s) {
  if (s.present) return { action: "desktop" };
  if (s.forceFetch) return { action: "fetch" };
  if (s.skipDownloadEnv) return { action: "browser", why: "skip-env" };
  const f = s.lastFailure;
  // a failure recorded in the future (a clock set back) does not hold the next try off
  if (f && s.now_ms >= f.at_ms && s.now_ms - f.at_ms < RETRY_AFTER_MS) return { action: "browser", why: "recent-failure" };
  return { action: "fetch" };
}

/** "3 h", "25 min", "40 s". */
export function formatAgo(ms) {
  const s = Math.max(0, Math.round(ms / 1000));
  if (s < 60) return `${s} s`;
  if (s < 3600) return `${Math.round(s / 60)} min`;
  return `${Math.round(s / 3600)} h`;
}

const AGAIN = `\`npm start -- ${FETCH_FLAG}\``;

export function fetchingLine(version) {
  return `Islet: the desktop runtime (Electron ${version}) is not installed yet; fetching it once with Electron's own install script (about 100 MB; it shows a progress bar while the download runs)...`;
}

export function fetchFailedLine(reason) {
  return `Islet: could not fetch the desktop runtime (${reason}); serving the studio in your browser instead (${AGAIN} tries again; without it there is no new try for a day).`;
}

export function recentFailureLine(failure, now_ms) {
  return `Islet: the desktop runtime (Electron) is not installed; the try to fetch it ${formatAgo(now_ms - failure.at_ms)} ago failed (${failure.reason}); serving the studio in your browser instead (${AGAIN} tries again now).`;
}

export const SKIP_ENV_LINE = `Islet: the desktop runtime (Electron) is not installed here: \`npm install\` does not download it (package.json's allowScripts, as ELECTRON_SKIP_BINARY_DOWNLOAD=1 would), and ELECTRON_SKIP_BINARY_DOWNLOAD is set, so \`npm start\` does not fetch it either; serving the studio in your browser instead (${AGAIN} fetches it anyway).`;

/**
 * The whole choice, with the effects passed in.
 * @param {{
 *   args: string[],
 *   env: Record<string, string | undefined>,
 *   version: string,
 *   findRuntime: () => string | null,
 *   fetchRuntime: (opts: { ignoreSkipEnv: boolean }) => Promise<FetchOutcome>,
 *   readFailure: () => FetchFailure | null,
 *   writeFailure: (f: FetchFailure) => void,
 *   clearFailure: () => void,
 *   now: () => number,
 *   log: (line: string) => void,
 * }} d
 * @returns {Promise<{ mode: "desktop", binary: string, fetched: boolean } | { mode: "browser" } | { mode: "stop", code: number }>}
 */
export async function chooseLaunch(d) {
  const forceFetch = d.args.includes(FETCH_FLAG);
  const binary = d.findRuntime();
  const lastFailure = binary || forceFetch ? null : d.readFailure();
  const decision = decideRuntime({ present: binary !== null, forceFetch, skipDownloadEnv: Boolean(d.env.ELECTRON_SKIP_BINARY_DOWNLOAD), lastFailure, now_ms: d.now() });
  if (decision.action === "desktop") return { mode: "desktop", binary: /** @type {string} */ (binary), fetched: false };
  if (decision.action === "browser") {
    d.log(decision.why === "skip-env" ? SKIP_ENV_LINE : recentFailureLine(/** @type {FetchFailure} */ (lastFailure), d.now()));
    return { mode: "browser" };
  }
  d.log(fetchingLine(d.version));
  let outcome = await d.fetchRuntime({ ignoreSkipEnv: forceFetch });
  if (!outcome.ok && outcome.interrupted) return { mode: "stop", code: 130 };
  if (outcome.ok) {
    const fetched = d.findRuntime();
    if (fetched) {
      d.clearFailure();
      return { mode: "desktop", binary: fetched, fetched: true };
    }
    outcome = { ok: false, reason: "the install script finished but left no runtime" };
  }
  d.writeFailure({ at_ms: d.now(), reason: outcome.reason });
  d.log(fetchFailedLine(outcome.reason));
  return { mode: "browser" };
}

/** The user's arguments for the app, without the launch script's own flag. */
export function appArgs(args) {
  return args.filter((a) => a !== FETCH_FLAG);
}
