// Ctrl+C: the run stops at its next check, leaves no report that claims to be complete, ends its worker threads
// and exits 130 (128 + SIGINT's number 2, as POSIX shells report a command ended by SIGINT; POSIX.1-2017, XCU
// 2.8.2). In-process with a stand-in for the key press, and for real through a pseudo terminal.
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { spawnSync } from "node:child_process";
import { runReport } from "../../../src/cli/commands/report.ts";
import { runSession, type InterruptSource } from "../../../src/cli/session.ts";
import { generateRadialNetwork } from "../../../src/model/generateNetwork.ts";
import { HAS_SCRIPT, ptyRun, sh } from "./ptyRun.ts";

const root = fileURLToPath(new URL("../../../", import.meta.url));
const cli = join(root, "src/cli/islet.mjs");
const demo = join(root, "assets/demo/dairy-coop.islet");
let dir = "";
let radial = "";

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "islet-interrupt-"));
  radial = join(dir, "radial-600.islet");
  writeFileSync(radial, JSON.stringify(generateRadialNetwork({ buses: 600, devices: 80, seed: 5 })));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));
afterEach(() => vi.restoreAllMocks());

function capture() {
  const out: string[] = [];
  const err: string[] = [];
  vi.spyOn(console, "log").mockImplementation((...a: unknown[]) => void out.push(a.join(" ")));
  vi.spyOn(console, "error").mockImplementation((...a: unknown[]) => void err.push(a.join(" ")));
  return { out, err };
}

/** A key press of the test's own, and a terminal whose progress writes can trigger it. */
function keyboard() {
  let handler: (() => void) | null = null;
  const interrupts: InterruptSource = {
    listen(h) {
      handler = h;
      return () => void (handler = null);
    },
  };
  const writes: string[] = [];
  let presses: { when: string; times: number } | null = null;
  let clock = 0;
  const stream = {
    isTTY: true,
    columns: 200,
    write(text: string) {
      writes.push(text);
      if (presses && text.includes(presses.when)) {
        const n = presses.times;
        presses = null;
        for (let k = 0; k < n; k++) handler?.();
      }
      return true;
    },
  };
  return {
    interrupts,
    stream,
    writes,
    // every update draws (the clock moves a second between readings), so a phase is seen as soon as it starts
    now: () => (clock += 1000),
    pressWhen: (when: string, times = 1) => void (presses = { when, times }),
    listening: () => handler !== null,
  };
}

const files = (d: string) => (existsSync(d) ? readdirSync(d, { recursive: true }).map(String).sort() : []);

describe("Ctrl+C in a command", () => {
  it("during the study: exit 130, one line saying so, and no output folder made", async () => {
    const io = capture();
    const k = keyboard();
    k.pressWhen("fault cases");
    const out = join(dir, "during-study");
    const code = await runReport([demo, "--out", out], { interrupts: k.interrupts, progressStream: k.stream, now: k.now });
    expect(code).toBe(130);
    expect(existsSync(out)).toBe(false);
    expect(io.err.join("\n")).toBe(`islet report: interrupted; no report written; ${out} is as it was`);
    // the caution was printed before the run, the summary of written files never
    expect(io.out.join("\n")).not.toMatch(/wrote \d+ file/);
    expect(k.listening()).toBe(false);
  }, 300_000);

  it("while the files are written: the staged files are removed and an earlier complete report is left as it was", async () => {
    capture();
    const out = join(dir, "while-writing");
    mkdirSync(join(out, "plots"), { recursive: true });
    writeFileSync(join(out, "report.html"), "<!doctype html><title>last week's complete report</title>");
    writeFileSync(join(out, "notes.txt"), "the user's own file");
    const before = files(out);
    const k = keyboard();
    k.pressWhen("writing files");
    expect(await runReport([demo, "--out", out, "--date", "2026-12-04"], { interrupts: k.interrupts, progressStream: k.stream, now: k.now })).toBe(130);
    expect(files(out)).toEqual(before);
    expect(readFileSync(join(out, "report.html"), "utf8")).toBe("<!doctype html><title>last week's complete report</title>");
  }, 300_000);

  it("a second Ctrl+C stops at once, after removing the staged files", async () => {
    capture();
    const out = join(dir, "twice");
    const k = keyboard();
    const exits: number[] = [];
    k.pressWhen("writing files", 2);
    const code = await runReport([demo, "--out", out], { interrupts: k.interrupts, progressStream: k.stream, now: k.now, exit: (c) => void exits.push(c) });
    expect(exits).toEqual([130]);
    expect(code).toBe(130);
    expect(existsSync(out)).toBe(false);
  }, 300_000);

  it("without Ctrl+C the same run writes the report, and no staging folder stays behind (nor one a killed run left)", async () => {
    capture();
    const out = join(dir, "whole");
    // a run killed with SIGKILL leaves its staging folder, named partial; the pid of a process that has ended
    const dead = spawnSync(process.execPath, ["-e", ""]).pid;
    mkdirSync(join(out, `.islet-report.partial-${dead}`, "plots"), { recursive: true });
    writeFileSync(join(out, `.islet-report.partial-${dead}`, "report.html"), "<!doctype html><p>cut sh");
    const k = keyboard();
    expect(await runReport([demo, "--out", out, "--format", "html,csv"], { interrupts: k.interrupts, progressStream: k.stream, now: k.now })).toBe(0);
    expect(files(out)).toEqual(["faults.csv", "report.html", "settings.csv", "verdicts.csv"]);
    expect(readFileSync(join(out, "report.html"), "utf8")).toMatch(/<\/html>\s*$/);
  }, 300_000);

  it.skipIf(!existsSync("/usr/bin/chromium"))("while the PDF is printed: the browser is closed, nothing is left, exit 130", async () => {
    capture();
    const out = join(dir, "while-printing");
    const k = keyboard();
    k.pressWhen("printing the PDF");
    expect(await runReport([demo, "--out", out, "--format", "html,pdf"], { interrupts: k.interrupts, progressStream: k.stream, now: k.now })).toBe(130);
    expect(existsSync(out)).toBe(false);
  }, 300_000);

  it("a session turns an error thrown after Ctrl+C (a cancelled study, a closed browser) into exit 130", async () => {
    capture();
    const k = keyboard();
    const code = await runSession("study", { interrupts: k.interrupts, progressStream: k.stream, now: k.now }, async (s) => {
      k.pressWhen("bus faults");
      s.progress.update("bus faults", 1, 10);
      expect(s.signal.aborted).toBe(true);
      throw new Error("cancelled underneath");
    });
    expect(code).toBe(130);
    // without Ctrl+C the error is the command's own and goes on up
    await expect(runSession("study", { interrupts: k.interrupts, progressStream: k.stream }, async () => Promise.reject(new Error("a real bug")))).rejects.toThrow("a real bug");
  });
});

describe.skipIf(!HAS_SCRIPT)("Ctrl+C typed on a real terminal", () => {
  it("islet report: exit 130, the folder it would have made is not there, and the terminal says so", async () => {
    const out = join(dir, "pty-report");
    const r = await ptyRun(`${sh(process.execPath)} ${sh(cli)} report ${sh(radial)} --out ${sh(out)} > /dev/null`, { ctrlCWhen: "fault cases" });
    expect(r.interrupted).toBe(true);
    expect(r.code).toBe(130);
    expect(existsSync(out)).toBe(false);
    expect(r.screen).toContain(`islet report: interrupted; no report written; ${out} is as it was`);
  }, 300_000);

  it("islet study --threads 2: exit 130 with nothing on stdout (the process ends, so its worker thread has ended)", async () => {
    const stdout = join(dir, "pty-study.txt");
    const r = await ptyRun(`${sh(process.execPath)} ${sh(cli)} study ${sh(radial)} --threads 2 > ${sh(stdout)}`, { ctrlCWhen: "bus faults" });
    expect(r.interrupted).toBe(true);
    expect(r.code).toBe(130);
    expect(readFileSync(stdout, "utf8")).toBe("");
    expect(r.screen).toContain("islet study: interrupted");
  }, 300_000);
});
