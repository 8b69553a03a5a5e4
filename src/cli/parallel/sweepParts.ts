// One thread's share of a sweep run by several: it claims device blocks of the transfer (the block solves) until
// none is left, then runs of buses (the faults), from counters every thread shares, so that a faster thread simply
// takes more. Slot 0 of the counters hands out blocks, slot 1 runs of buses.
import { sweepBuses, sweepTransfers, type CompiledNetwork, type SweepArrays, type SweepPartOutcome, type SweepPlan } from "../../engine/index.ts";

export function runSweepShare(network: CompiledNetwork, plan: SweepPlan, arrays: SweepArrays, counters: Int32Array): SweepPartOutcome {
  sweepTransfers(plan, arrays, () => Atomics.add(counters, 0, 1));
  return sweepBuses(network, plan, arrays, () => Atomics.add(counters, 1, 1));
}
