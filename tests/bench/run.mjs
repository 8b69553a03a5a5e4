// `npm run bench`: runs every tests/bench/*.ts (helpers named lib*.ts excluded) one after another with
// `node --import tsx`, streams their figures and sums up the PASS/MISS target lines they print.
// Exits non-zero only when a benchmark crashes, never on a missed target.
// `npm run bench -- engine study` runs only the files whose names contain one of the words.
import { spawn } from "node:child_process";
import { readdirSync } from "node:fs";
import { join, dirname } from "node:path";
import { fileURLToPath } from "node:url";

const dir = dirname(fileURLToPath(import.meta.url));
const filters = process.argv.slice(2);
const files = readdirSync(dir)
  .filter((f) => f.endsWith(".ts") && !f.startsWith("lib") && !f.endsWith(".d.ts"))
  .filter((f) => filters.length === 0 || filters.some((w) => f.includes(w)))
  .sort();

function run(file) {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ["--expose-gc", "--import", "tsx", join(dir, file)], { stdio: ["ignore", "pipe", "inherit"] });
    let pass = 0;
    let miss = 0;
    let rest = "";
    child.stdout.on("data", (chunk) => {
      process.stdout.write(chunk);
      const lines = (rest + chunk.toString()).split("\n");
      rest = lines.pop() ?? "";
      for (const l of lines) {
        if (/^\s*PASS\b/.test(l)) pass++;
        if (/^\s*MISS\b/.test(l)) miss++;
      }
    });
    child.on("close", (code, signal) => resolve({ file, code: code ?? 1, signal, pass, miss }));
    child.on("error", (err) => {
      console.error(`bench: cannot start ${file}: ${err.message}`);
      resolve({ file, code: 1, signal: null, pass, miss });
    });
  });
}

if (files.length === 0) {
  console.error(`bench: no benchmark in ${dir}${filters.length ? ` matching ${filters.join(", ")}` : ""}`);
  process.exit(1);
}
const results = [];
for (const f of files) {
  console.log(`\n=== ${f} ===`);
  const t0 = performance.now();
  const r = await run(f);
  r.seconds = (performance.now() - t0) / 1000;
  results.push(r);
}
console.log("\n=== summary ===");
for (const r of results) {
  const status = r.code === 0 ? "ok" : `CRASHED (exit ${r.code}${r.signal ? `, ${r.signal}` : ""})`;
  console.log(`${r.file.padEnd(16)} ${status.padEnd(22)} targets: ${r.pass} PASS, ${r.miss} MISS   (${r.seconds.toFixed(1)} s)`);
}
process.exit(results.some((r) => r.code !== 0) ? 1 : 0);
