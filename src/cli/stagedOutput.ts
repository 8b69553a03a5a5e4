// Output files written so that an interrupted run never leaves a report that looks complete: every file goes
// first into a staging folder inside the output folder, named as partial (".islet-report.partial-<pid>"), and only
// when all are written are they moved into place, each by a rename within one file system. Stopped before that,
// the staging folder is removed and the output folder holds what it held before (a kill -9 leaves the staging
// folder, named partial, which the next run in that folder removes).
import { existsSync, mkdirSync, readdirSync, renameSync, rmdirSync, rmSync, writeFileSync } from "node:fs";
import { dirname, join } from "node:path";

const PARTIAL_PREFIX = ".islet-report.partial-";

function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === "EPERM";
  }
}

/** Staging folders left in `dir` by runs that are no longer alive (killed before they could clean up). */
export function staleStagingFolders(dir: string): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir)
    .filter((n) => n.startsWith(PARTIAL_PREFIX))
    .filter((n) => {
      const pid = Number(n.slice(PARTIAL_PREFIX.length));
      return Number.isInteger(pid) && pid > 0 && pid !== process.pid && !processAlive(pid);
    })
    .map((n) => join(dir, n));
}

export class StagedOutput {
  readonly outDir: string;
  readonly stagingDir: string;
  private readonly createdOut: boolean;
  private readonly names: string[] = [];
  private committed = false;
  private discarded = false;

  constructor(outDir: string) {
    this.outDir = outDir;
    this.createdOut = !existsSync(outDir);
    mkdirSync(outDir, { recursive: true });
    for (const stale of staleStagingFolders(outDir)) rmSync(stale, { recursive: true, force: true });
    this.stagingDir = join(outDir, `${PARTIAL_PREFIX}${process.pid}`);
    rmSync(this.stagingDir, { recursive: true, force: true });
    mkdirSync(this.stagingDir);
  }

  /** Writes `name` (a path relative to the output folder) into the staging folder. */
  write(name: string, data: string | Uint8Array): void {
    // after discard (a second Ctrl+C) nothing may be written again
    if (this.discarded) return;
    const path = join(this.stagingDir, name);
    mkdirSync(dirname(path), { recursive: true });
    writeFileSync(path, data);
    this.names.push(name);
  }

  /** Moves every staged file into the output folder; returns their paths there, in the order written. */
  commit(): string[] {
    const paths: string[] = [];
    for (const name of this.names) {
      const target = join(this.outDir, name);
      mkdirSync(dirname(target), { recursive: true });
      renameSync(join(this.stagingDir, name), target);
      paths.push(target);
    }
    rmSync(this.stagingDir, { recursive: true, force: true });
    this.committed = true;
    return paths;
  }

  /** Removes the staging folder, and the output folder if this run made it and it is empty. Synchronous. */
  discard(): void {
    if (this.committed) return;
    this.discarded = true;
    rmSync(this.stagingDir, { recursive: true, force: true });
    if (this.createdOut) {
      try {
        rmdirSync(this.outDir);
      } catch {
        // not empty: something else was put there meanwhile; leave it
      }
    }
  }
}
