// What the one-line draws on top of the diagram after a fault calculation: plain data made from
// the engine's fault result and the study's device responses (see fault/toOverlay.ts).
import type { DeviceRole, FaultType } from "../../src/study/types.ts";

export interface BranchFlow {
  /** Largest phase current through the element, primary A. */
  i_A: number;
  /** Which terminal the current flows towards: "a" (from/HV/busA/bus side) or "b". */
  towards: "a" | "b";
}

export interface DeviceMark {
  role: DeviceRole;
  /** Clearing time in seconds; null when the device does not operate. */
  tClear_s: number | null;
}

export interface FaultOverlay {
  /** Element id of the faulted bus or line. */
  at: string;
  label: string;
  faultType: FaultType;
  /** Initial symmetrical short-circuit current at the fault, kA. */
  ikss_kA: number;
  /** Bus voltages during the fault: smallest phase voltage in pu of nominal. */
  busVoltages_pu: Record<string, number>;
  flows: Record<string, BranchFlow>;
  devices: Record<string, DeviceMark>;
}
