// Worker thread of a SweepPool: compiles the networks it is given and takes part in the sweeps it is asked to,
// writing into the arrays the caller shares with it.
import { parentPort } from "node:worker_threads";
import { compileNetwork, planSweep, type CompiledNetwork } from "../../engine/index.ts";
import type { PoolCall, PoolReply } from "./protocol.ts";
import { runSweepShare } from "./sweepParts.ts";

const port = parentPort;
if (!port) throw new Error("sweepWorker: must run as a worker thread");
const networks = new Map<string, CompiledNetwork>();

port.on("message", (call: PoolCall) => {
  if (call.kind === "load") {
    const r = compileNetwork(call.project, call.compile);
    if (r.ok) networks.set(call.key, r.network);
    else networks.delete(call.key);
    return;
  }
  let reply: PoolReply;
  try {
    const network = networks.get(call.key);
    if (!network) throw new Error(`network ${call.key} is not loaded or did not compile`);
    // The same network and options give every thread the same plan (planSweep is deterministic).
    const plan = planSweep(network, call.options);
    reply = { kind: "done", id: call.id, outcome: runSweepShare(network, plan, call.arrays, call.counters, call.faultsFirst) };
  } catch (err) {
    reply = { kind: "failed", id: call.id, message: err instanceof Error ? err.message : String(err) };
  }
  port.postMessage(reply);
});
