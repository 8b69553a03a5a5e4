// What the app was asked to open at launch: a project file (command line, file association),
// the demo (--demo, used by `npm start`), or nothing. Chromium switches are ignored, and only
// a ".islet" path counts as a file, so stray arguments (an app path, a script) open nothing.
import { isAbsolute, resolve } from "node:path";
import type { FileRef, MenuCommand } from "../src/model/hostContract.ts";

const PROJECT_SUFFIX = ".islet";

export interface LaunchRequest {
  file: string | null;
  demo: boolean;
  dev: boolean;
}

/**
 * @param argv process.argv
 * @param defaultApp true when run as `electron <app>` (process.defaultApp): argv[1] is then the app path
 */
export function parseLaunchArgs(argv: readonly string[], defaultApp: boolean, cwd: string): LaunchRequest {
  const args = argv.slice(defaultApp ? 2 : 1);
  let file: string | null = null;
  let demo = false;
  let dev = false;
  for (const arg of args) {
    if (arg === "--demo") demo = true;
    else if (arg === "--dev") dev = true;
    else if (arg.startsWith("-") || !arg.toLowerCase().endsWith(PROJECT_SUFFIX)) continue;
    else if (file === null) file = isAbsolute(arg) ? arg : resolve(cwd, arg);
  }
  return { file, demo, dev };
}

/**
 * Whether DevTools and the reload items are on: in an unpackaged build (a developer's checkout) always, in a
 * packaged app never; it ignores --dev, so a user cannot be talked into opening a console on the studio.
 */
export function developerToolsAllowed(isPackaged: boolean, _request: LaunchRequest): boolean {
  return !isPackaged;
}

/** The first thing the studio is told to do: open the given file, else the demo on request or on first start. */
export function startupCommand(request: LaunchRequest, firstStart: boolean, refFor: (path: string) => FileRef): MenuCommand | null {
  if (request.file) return { openRecent: refFor(request.file) };
  if (request.demo || firstStart) return "openDemo";
  return null;
}
