// One thread's share of a sweep run by several: it claims device blocks of the transfer (the block solves) and runs
// of buses (the faults) from counters every thread shares, until none is left, so that a faster thread simply takes
// more. Slot 0 of the counters hands out blocks, slot 1 runs of buses. The two kinds of work are independent; one
// thread starting with the memory-bound block solves while another starts with the compute-bound faults contend
// less for the memory system than both doing the same.
import { sweepBuses, sweepTransfers, type CompiledNetwork, type SweepArrays, type SweepPartOutcome, type SweepPlan } from "../../engine/index.ts";

export function runSweepShare(network: CompiledNetwork, plan: SweepPlan, arrays: SweepArrays, counters: Int32Array, faultsFirst: boolean): SweepPartOutcome {
  const blocks = () => Atomics.add(counters, 0, 1);
  const runs = () => Atomics.add(counters, 1, 1);
  if (!faultsFirst) sweepTransfers(plan, arrays, blocks);
  const outcome = sweepBuses(network, plan, arrays, runs);
  if (faultsFirst) sweepTransfers(plan, arrays, blocks);
  return outcome;
}
