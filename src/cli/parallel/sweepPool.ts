// All-bus sweeps spread over threads (Node worker_threads): the caller's thread and `threads - 1` workers claim
// device blocks and runs of buses from shared counters (see sweepParts.ts) and write into arrays on shared memory,
// so that the result needs no copying. Every thread compiles the same network from the same project and derives the
// same sweep plan, so the shares fit together; the result equals that of sweepFaults bit for bit.
import { Worker } from "node:worker_threads";
import { allocateSweep, assembleSweep, compileNetwork, planSweep, type CompileOptions, type CompiledNetwork, type SweepOptions, type SweepResult } from "../../engine/index.ts";
import type { Project } from "../../model/schema.ts";
import type { PoolCall, PoolReply } from "./protocol.ts";
import { runSweepShare } from "./sweepParts.ts";

// Beside this module: the TypeScript source in development, sweepWorker.mjs beside the bundled command (build-cli).
const workerUrl = new URL(import.meta.url.endsWith(".ts") ? "./sweepWorker.ts" : "./sweepWorker.mjs", import.meta.url);

/** Workers reject process-wide flags such as --expose-gc: keep only the parent's module loader flags. */
function workerExecArgv(): string[] {
  const argv: string[] = [];
  const parent = process.execArgv;
  for (let i = 0; i < parent.length; i++) {
    const a = parent[i];
    if (/^--(import|loader|experimental-loader|require)=/.test(a)) argv.push(a);
    else if (/^--(import|loader|experimental-loader|require)$/.test(a) || a === "-r") argv.push(a, parent[++i] ?? "");
  }
  return argv;
}

/** A worker on the sweep worker module; a TypeScript source (development, tests) is loaded through tsx's hooks. */
function startWorker(): Worker {
  const execArgv = workerExecArgv();
  if (!workerUrl.pathname.endsWith(".ts")) return new Worker(workerUrl, { execArgv });
  const boot = `import(${JSON.stringify(import.meta.resolve("tsx/esm/api"))}).then((m) => { m.register(); return import(${JSON.stringify(workerUrl.href)}); });`;
  return new Worker(boot, { eval: true, execArgv });
}

/** A network compiled here, and in every worker under the key. */
export interface PoolNetwork {
  key: string;
  network: CompiledNetwork;
}

export class SweepPool {
  readonly threads: number;
  private readonly callerWorks: boolean;
  private readonly workers: Worker[];
  private readonly pending = new Map<number, (r: PoolReply) => void>();
  private nextId = 1;

  /**
   * `threads` counts the caller's own: 2 starts one worker. `callerWorks: false` leaves all the work to the workers
   * (tests of the worker path).
   */
  constructor(threads: number, opts: { callerWorks?: boolean } = {}) {
    if (!Number.isInteger(threads) || threads < 1) throw new Error(`SweepPool: threads must be an integer >= 1 (got ${threads})`);
    this.threads = threads;
    this.callerWorks = opts.callerWorks !== false;
    if (!this.callerWorks && threads < 2) throw new Error("SweepPool: with callerWorks false, threads must be at least 2");
    this.workers = Array.from({ length: threads - 1 }, () => {
      const w = startWorker();
      w.on("message", (reply: PoolReply) => {
        this.pending.get(reply.id)?.(reply);
        this.pending.delete(reply.id);
      });
      w.on("error", (err) => {
        for (const resolve of this.pending.values()) resolve({ kind: "failed", id: 0, message: err.message });
        this.pending.clear();
      });
      return w;
    });
  }

  /**
   * Compiles the project's network in every worker, and here unless `network` is that network already compiled
   * with the same options; the key names it in later sweeps.
   */
  load(key: string, project: Project, compile: CompileOptions, network?: CompiledNetwork): PoolNetwork {
    let net = network;
    if (!net) {
      const r = compileNetwork(project, compile);
      if (!r.ok) throw new Error(`SweepPool: the network does not compile: ${r.errors.map((e) => e.text).join("; ")}`);
      net = r.network;
    }
    const call: PoolCall = { kind: "load", key, project, compile };
    for (const w of this.workers) w.postMessage(call);
    return { key, network: net };
  }

  /** The sweep of a loaded network, shared among the threads. Progress callbacks are not called. */
  async sweep(net: PoolNetwork, options: SweepOptions = {}): Promise<SweepResult> {
    const { onProgress: _ignored, ...plain } = options;
    const plan = planSweep(net.network, plain);
    const arrays = allocateSweep(plan, (n) => new Float64Array(new SharedArrayBuffer(n * 8)));
    const counters = new Int32Array(new SharedArrayBuffer(8));
    // The caller starts with the block solves, the first worker with the faults, and so on alternately.
    const replies = this.workers.map((w, i) => {
      const id = this.nextId++;
      const done = new Promise<PoolReply>((resolve) => this.pending.set(id, resolve));
      const call: PoolCall = { kind: "share", id, key: net.key, options: plain, arrays, counters, faultsFirst: i % 2 === 0 };
      w.postMessage(call);
      return done;
    });
    const outcomes = this.callerWorks ? [runSweepShare(net.network, plan, arrays, counters, false)] : [];
    for (const reply of await Promise.all(replies)) {
      if (reply.kind === "failed") throw new Error(`SweepPool: a worker failed: ${reply.message}`);
      outcomes.push(reply.outcome);
    }
    return assembleSweep(net.network, plan, arrays, outcomes);
  }

  async close(): Promise<void> {
    await Promise.all(this.workers.map((w) => w.terminate()));
  }
}
