// Public API of the fault engine. Everything else under src/engine is internal and may change.
export * from "./types.ts";
export { EngineFailure, failureMessage, NOT_SOLVED, OUT_OF_RANGE } from "./engineFailure.ts";
export { compileNetwork } from "./network/compileNetwork.ts";
export { solveFault } from "./fault/solveFault.ts";
export { sweepFaults, sweepFaultsAsync, planSweep, allocateSweep, sweepTransfers, sweepBuses, assembleSweep, counter, SWEEP_CHUNK, type Claim, type SweepPlan, type SweepArrays, type SweepPartOutcome } from "./fault/sweepFaults.ts";
export { sweepDeviceCurrents, sweepDeviceCurrentsInto } from "./fault/sweepDeviceCurrents.ts";
export { runLoadFlow } from "./loadflow/runLoadFlow.ts";
export { loadCurrents } from "./loadflow/loadCurrents.ts";
export { voltageFactor, transformerKT, generatorKG, peakFactor, breakingFactorMu, thermalFactorM } from "./iec60909/factors.ts";
export { engineConventions, type EngineConvention } from "./conventions.ts";
export { handleRequest, createHandlerState, type HandlerState } from "./rpc/handleRequest.ts";
export { transferables } from "./rpc/protocol.ts";
export type { EngineRequest, EngineResponse, EngineEvent } from "./rpc/protocol.ts";
export { busFaultTable, busFaultTableWith, BUS_TABLE_SWEEP, formatBusFaultTable, type BusFaultTable, type BusFaultRun, type BusFaultRow, type BusFaultTask } from "./table/busFaultTable.ts";
export { createReopenContext, reopenedSet, referenceNetwork, solveReopened, type ReopenContext, type ReopenedSet, type OpenEnd } from "./reopen/reopenNetwork.ts";
export { sweepReopened, type ReopenSweepOptions } from "./reopen/reopenSweep.ts";
export { solveLinePoint } from "./reopen/linePoint.ts";
export { openSetKey } from "./network/openEnds.ts";
