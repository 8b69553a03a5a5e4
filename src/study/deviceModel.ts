// What the study needs from the protective-device models: the operating answer on a tolerance band
// and the lowest pickup per measured quantity. protectionModel.ts binds it to src/protection.
import type { ProtectiveDevice } from "../model/schema.ts";
import type { Band, Measurement, OperatingResult, TravelState } from "../protection/types.ts";
import type { BandTimes } from "../protection/deviceTimer.ts";

export interface DevicePickups {
  /**
   * Lowest pickup of the short-circuit elements on phase current. For an LV breaker that is the short-time
   * or instantaneous pickup when it has one (its long-time element is overload protection: a fault cleared
   * only by it takes seconds to minutes, common practice); for relays and fuses their lowest phase pickup.
   */
  phase_A: number | null;
  /** Lowest phase pickup of any element, overload elements included: what load current must stay below. */
  overload_A: number | null;
  residual_A: number | null;
  negative_A: number | null;
}

export interface DeviceModel {
  operate(device: ProtectiveDevice, m: Measurement, band: Band): OperatingResult;
  /**
   * Optional fast path: the numbers of `operate` on all three bands at once, without reason text. A model
   * that has it must give exactly what `operate` gives (deviceResponse uses one or the other).
   */
  operateBands?(device: ProtectiveDevice, m: Measurement): BandTimes;
  /** Lowest nominal pickup of the enabled elements per measured quantity, A (null: no such element). */
  pickups(device: ProtectiveDevice): DevicePickups;
  /** Time still needed to operate from a travel state at a steady measurement (nominal band). */
  timeToOperate(state: TravelState, device: ProtectiveDevice, m: Measurement): OperatingResult;
  /** Advance a travel state by dt_s at a steady measurement (nominal band). */
  accumulate(state: TravelState, device: ProtectiveDevice, m: Measurement, dt_s: number): TravelState;
}
