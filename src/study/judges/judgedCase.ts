// What every judge reads of one case: the fault, the devices' answers at the first state, the expected
// isolation and its failure variants, and the simulated outcomes.
import type { Criteria, Element, ProtectiveDevice } from "../../model/schema.ts";
import type { DeviceModel } from "../deviceModel.ts";
import type { ProtectedSide } from "../deviceSides.ts";
import type { IsolationContext, IsolationPlan } from "../operation/expectedIsolation.ts";
import type { SimulationOutcome } from "../operation/simulateCase.ts";
import type { ScenarioNetwork } from "../scenarioNetwork.ts";
import type { DeviceResponse, FaultCase } from "../types.ts";

export interface FailureCase {
  /** The expected edge whose breaker is stuck. */
  edge: number;
  plan: IsolationPlan;
  outcome: SimulationOutcome;
}

export interface JudgedCase {
  fc: FaultCase;
  iFault_A: number;
  /** First-state answers of every device that carries current (absent: no current). */
  responses: ReadonlyMap<string, DeviceResponse>;
  plan: IsolationPlan;
  outcome: SimulationOutcome;
  failures: FailureCase[];
  /** True at the scenario's sensitivity limit (its minimum where it has one). */
  atSensitivityLimit: boolean;
}

export interface JudgeContext {
  net: ScenarioNetwork;
  isolation: IsolationContext;
  model: DeviceModel;
  criteria: Criteria;
  elements: ReadonlyMap<string, Element>;
  devices: ReadonlyMap<string, ProtectiveDevice>;
  sides: ReadonlyMap<string, ProtectedSide>;
}

/** The expected edge a device sits on in `plan`, or undefined. */
export function planEdgeOf(ctx: JudgeContext, plan: IsolationPlan, device: string): number | undefined {
  const edge = ctx.net.deviceEdge.get(device);
  return edge !== undefined && plan.edges.includes(edge) ? edge : undefined;
}

/** `Q-T1 "Transformer 1 LV incomer"`: the id, with the name where there is one. */
export function named(ctx: Pick<JudgeContext, "elements">, id: string): string {
  const name = ctx.elements.get(id)?.name;
  return name ? `${id} "${name}"` : id;
}

/** `R-T1 "Transformer 1 HV relay" 51`: the device named, with the relay function that operates. */
export function deviceWords(ctx: Pick<JudgeContext, "elements" | "devices">, id: string, functionId: string | null = null): string {
  const device = ctx.devices.get(id);
  const fn = device?.kind === "relay" && functionId ? device.functions.find((f) => f.id === functionId) : undefined;
  return fn ? `${named(ctx, id)} ${fn.ansi}` : named(ctx, id);
}
