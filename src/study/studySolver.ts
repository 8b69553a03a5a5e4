// What the study needs from a network solver, stated once so the study logic can be tested on plain
// data and the engine adapter (engineSolver.ts) is the only place that knows the engine's API.
import type { Scenario } from "../model/schema.ts";
import type { Measurement } from "../protection/types.ts";
import type { CurrentDirection, FaultLimit, FaultLocation, FaultType } from "./types.ts";

/** What one device measures in one fault state, and which way the current flows. */
export interface DeviceReading {
  m: Measurement;
  direction: CurrentDirection;
}

/** One solved fault state: readings of every device with current (absent = no current). */
export interface FaultSnapshot {
  /** Largest phase current into the fault, A. */
  iFault_A: number;
  readings: Record<string, DeviceReading>;
  /** Engine messages worth passing on (element named). */
  messages: string[];
  /** Set when the engine could not solve this state: the reason, naming the elements. No current is given then. */
  unsolved?: string;
}

/** An element end opened by a device (the element the device looks into, at that end). */
export interface OpenEnd {
  element: string;
  end: "from" | "to" | "terminal";
}

export interface StudySolver {
  /** Faults of one type and limit at many locations of one scenario (the bulk of the study). */
  /** `devices`: when given, only these devices' readings are needed (a snapshot may leave the others out). */
  solveMany(scenario: Scenario, locations: FaultLocation[], faultType: FaultType, limit: FaultLimit, devices?: readonly string[]): FaultSnapshot[];
  /**
   * Optional: the same answers read one at a time (`at(i)` is `solveMany(...)[i]`, asked for at most once each,
   * in increasing order), so that a large study holds one snapshot at a time instead of every location's readings
   * and solves only the locations it reads.
   */
  solveEach?(scenario: Scenario, locations: FaultLocation[], faultType: FaultType, limit: FaultLimit, devices?: readonly string[]): (i: number) => FaultSnapshot;
  /**
   * Optional: faults at many locations of one scenario, of several fault types, with the same element ends opened
   * (the simulated operation groups its cases by what has opened). `at(i, type)` is
   * `solveOne(scenario, locations[i], type, limit, open)`.
   */
  solveOpenedEach?(scenario: Scenario, open: OpenEnd[], locations: FaultLocation[], faultTypes: readonly FaultType[], limit: FaultLimit): (i: number, faultType: FaultType) => FaultSnapshot;
  /** One fault with some element ends opened (clearing timeline). */
  solveOne(scenario: Scenario, location: FaultLocation, faultType: FaultType, limit: FaultLimit, open: OpenEnd[]): FaultSnapshot;
  /**
   * Optional: the short-circuit duty at a bus in a scenario at the maximum limit, the largest over the fault
   * types: I"k (fault current), Ib (breaking) and ip (peak), kA; null when it cannot be solved.
   */
  busDuty?(scenario: Scenario, bus: string): { ikss_kA: number; ib_kA: number; ip_kA: number } | null;
  /** Largest phase load current at each device (device id -> A) from a balanced load flow; null when it cannot run. */
  loadCurrents(scenario: Scenario): Record<string, number> | null;
}
