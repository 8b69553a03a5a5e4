// The usual command-line manners: --version, `islet help COMMAND`, `islet COMMAND --help`, and usage errors from
// node:util parseArgs in our words. The CLI is run as a user runs it (src/cli/islet.mjs in a child process).
import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { parseCommandArgs, formatHelp } from "../../../src/cli/args.ts";
import { checkSpec, parseCheckArgs } from "../../../src/cli/commands/checkArgs.ts";
import { studySpec } from "../../../src/cli/commands/study.ts";

const root = fileURLToPath(new URL("../../../", import.meta.url));

function islet(...args: string[]) {
  const r = spawnSync(process.execPath, [join(root, "src/cli/islet.mjs"), ...args], { cwd: root, encoding: "utf8", timeout: 120_000 });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

const COMMANDS = ["validate", "summary", "study", "check", "report"];

describe("islet --version and help", () => {
  it("--version prints the version in package.json", () => {
    const version = JSON.parse(readFileSync(join(root, "package.json"), "utf8")).version;
    const r = islet("--version");
    expect(r.code).toBe(0);
    expect(r.out).toBe(`islet ${version}\n`);
    expect(r.err).toBe("");
  });

  it("`islet help COMMAND` and `islet COMMAND --help` give the same help, with options and examples, for every command", () => {
    for (const name of COMMANDS) {
      const a = islet("help", name);
      const b = islet(name, "--help");
      expect(a.code, name).toBe(0);
      expect(b.code, name).toBe(0);
      expect(b.out, name).toBe(a.out);
      expect(a.out).toMatch(new RegExp(`^Usage: islet ${name} `));
      expect(a.out).toMatch(/\nOptions:\n/);
      expect(a.out).toMatch(/\nExamples:\n {2}islet /);
      expect(a.out).toContain("-h, --help");
    }
    expect(islet("check", "-h").out).toContain("--fault TYPE");
  });

  it("lists every command and how to get help, and refuses an unknown one", () => {
    const r = islet("help");
    expect(r.code).toBe(0);
    for (const name of COMMANDS) expect(r.out).toContain(`  ${name} `);
    expect(r.out).toContain("islet help <command>");
    const bad = islet("help", "frobnicate");
    expect(bad.code).toBe(2);
    expect(bad.err).toContain('unknown command "frobnicate"');
  });

  it("reports a usage error in one place with the usage line and where the help is", () => {
    const r = islet("study", "x.islet", "--colour");
    expect(r.code).toBe(2);
    expect(r.out).toBe("");
    expect(r.err).toBe(`islet study: unknown option --colour\nUsage: islet study ${studySpec.synopsis}\nRun "islet help study" for the options.\n`);
  });
});

describe("options read with parseArgs", () => {
  it("puts parseArgs's errors in our words", () => {
    expect(parseCommandArgs(studySpec, ["f", "--fast"])).toEqual({ ok: false, message: "unknown option --fast" });
    expect(parseCommandArgs(studySpec, ["f", "--scenario"])).toEqual({ ok: false, message: "option --scenario needs a value" });
    expect(parseCommandArgs(studySpec, ["f", "--scenario", "--json"])).toEqual({ ok: false, message: "option --scenario needs a value" });
    expect(parseCommandArgs(studySpec, ["f", "--json=yes"])).toEqual({ ok: false, message: "option --json takes no value" });
    expect(parseCommandArgs(studySpec, ["f", "--scenario=island", "-q"])).toMatchObject({ ok: true, values: { scenario: "island", quiet: true }, positionals: ["f"] });
    // a name that starts with a dash is given after "--"
    expect(parseCommandArgs(studySpec, ["--", "-odd.islet"])).toMatchObject({ ok: true, positionals: ["-odd.islet"] });
  });

  it("reads check's repeated filters, quiet and fault types, and refuses what it cannot use", () => {
    const a = parseCheckArgs(["f.islet", "--scenario", "s1", "--bus", "B1", "--bus", "B2", "--fault", "lg", "--json", "--quiet"]);
    expect(a.ok && a.value).toEqual({ file: "f.islet", json: true, scenarios: ["s1"], buses: ["B1", "B2"], faults: ["LG"], quiet: true });
    expect(parseCheckArgs(["f.islet", "--fault", "2ph"])).toEqual({ ok: false, message: "--fault must be one of 3ph, LL, LG, LLG (got 2ph)" });
    expect(parseCheckArgs(["f.islet", "--colour"])).toEqual({ ok: false, message: "unknown option --colour" });
    expect(parseCheckArgs(["--json"])).toEqual({ ok: false, message: "missing FILE" });
    expect(parseCheckArgs(["a.islet", "b.islet"])).toEqual({ ok: false, message: "expected one FILE, got 2" });
    expect(formatHelp(checkSpec)).toContain("--scenario ID");
    expect(formatHelp(checkSpec)).toContain("(may be repeated)");
  });
});
