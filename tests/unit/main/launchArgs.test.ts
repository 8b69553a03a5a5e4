// What the app opens at launch (project brief: the demo on first start, or a file passed on the
// command line). argv layout: Electron docs, process.defaultApp (argv[1] is the app path then).
import { describe, expect, it } from "vitest";
import { resolve } from "node:path";
import { developerToolsAllowed, parseLaunchArgs, startupCommand } from "../../../main/launchArgs.ts";

const ref = (p: string) => ({ name: p.split("/").pop()!, key: p });

describe("launch arguments", () => {
  it("skips the app path when run as `electron .`", () => {
    expect(parseLaunchArgs(["/usr/bin/electron", ".", "--demo"], true, "/w")).toEqual({ file: null, demo: true, dev: false });
  });

  it("takes the first non-flag argument of a packaged app as the file, resolved against cwd", () => {
    const r = parseLaunchArgs(["/opt/Islet/islet", "--no-sandbox", "sites/plant.islet", "other.islet"], false, "/home/u");
    expect(r.file).toBe(resolve("/home/u", "sites/plant.islet"));
  });

  it("ignores arguments that are not project files (an app path, a script, a process serial number)", () => {
    expect(parseLaunchArgs(["/usr/bin/node", "out/main/main.cjs", "-psn_0_1234", "notes.txt"], false, "/w").file).toBeNull();
    expect(parseLaunchArgs(["islet", "/sites/Plant.ISLET"], false, "/w").file).toBe("/sites/Plant.ISLET"); // suffix compared without case
  });

  it("recognises --dev", () => {
    expect(parseLaunchArgs(["islet", "--dev"], false, "/").dev).toBe(true);
  });
});

describe("startup command", () => {
  it("opens a file given on the command line, even on first start", () => {
    expect(startupCommand({ file: "/s/a.islet", demo: false, dev: false }, true, ref)).toEqual({ openRecent: { name: "a.islet", key: "/s/a.islet" } });
  });
  it("opens the demo on first start or when asked", () => {
    expect(startupCommand({ file: null, demo: false, dev: false }, true, ref)).toBe("openDemo");
    expect(startupCommand({ file: null, demo: true, dev: false }, false, ref)).toBe("openDemo");
  });
  it("leaves a later start to the studio (recovery offer or empty project)", () => {
    expect(startupCommand({ file: null, demo: false, dev: false }, false, ref)).toBeNull();
  });
});

describe("developer tools", () => {
  // hardening report, item 14: a packaged app still honoured --dev (DevTools and the reload menu)
  it("are never on in a packaged app, --dev or not", () => {
    expect(developerToolsAllowed(true, parseLaunchArgs(["/opt/Islet/islet", "--dev"], false, "/"))).toBe(false);
    expect(developerToolsAllowed(true, parseLaunchArgs(["/opt/Islet/islet"], false, "/"))).toBe(false);
  });
  it("are on in an unpackaged build", () => {
    expect(developerToolsAllowed(false, parseLaunchArgs(["/usr/bin/electron", ".", "--dev"], true, "/w"))).toBe(true);
    expect(developerToolsAllowed(false, parseLaunchArgs(["/usr/bin/electron", "."], true, "/w"))).toBe(true);
  });
});
