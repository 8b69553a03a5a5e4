// Binds the study's DeviceModel to src/protection. A device with impossible settings does not operate
// in the study; the settings error is reported once through `warn`, naming the device and the field.
// A model serves one study: devices are not edited while it runs, so each device is checked and compiled
// once (pickups and the fast timer are kept per device).
import type { ProtectiveDevice } from "../model/schema.ts";
import {
  accumulate,
  deviceTimer,
  operatingTime,
  SettingsError,
  timeToOperate,
  type Band,
  type BandTimes,
  type DeviceTimer,
  type Measurement,
  type OperatingResult,
  type TravelState,
} from "../protection/index.ts";
import { deviceElements } from "../protection/deviceElements.ts";
import type { DeviceModel, DevicePickups } from "./deviceModel.ts";

export function protectionModel(warn: (text: string) => void = () => {}): DeviceModel {
  const pickups = new Map<string, DevicePickups>();
  const broken = new Set<string>();
  const refuse = (device: ProtectiveDevice, err: unknown): void => {
    if (broken.has(device.id)) return;
    broken.add(device.id);
    const text = err instanceof SettingsError ? err.message : err instanceof Error ? err.message : String(err);
    warn(`${text} (left out of the study)`);
  };
  const none: OperatingResult = { picked: false, trip_s: Infinity, clearing_s: Infinity, reason: "settings error" };
  const noneBands: BandTimes = { picked: false, functionId: null, trip_s: Infinity, clearing_s: Infinity, clearingMin_s: Infinity, clearingMax_s: Infinity };
  const timers = new WeakMap<ProtectiveDevice, DeviceTimer | null>();
  return {
    operate(device: ProtectiveDevice, m: Measurement, band: Band): OperatingResult {
      if (broken.has(device.id)) return none;
      try {
        return operatingTime(device, m, { band });
      } catch (err) {
        refuse(device, err);
        return none;
      }
    },
    operateBands(device: ProtectiveDevice, m: Measurement): BandTimes {
      if (broken.has(device.id)) return { ...noneBands };
      let timer = timers.get(device);
      if (timer === undefined) {
        try {
          timer = deviceTimer(device);
        } catch (err) {
          refuse(device, err);
          timer = null;
        }
        timers.set(device, timer);
      }
      return timer ? timer.bands(m) : { ...noneBands };
    },
    timeToOperate(state: TravelState, device: ProtectiveDevice, m: Measurement): OperatingResult {
      if (broken.has(device.id)) return none;
      try {
        return timeToOperate(state, device, m);
      } catch (err) {
        refuse(device, err);
        return none;
      }
    },
    accumulate(state: TravelState, device: ProtectiveDevice, m: Measurement, dt_s: number): TravelState {
      if (broken.has(device.id)) return state;
      try {
        return accumulate(state, device, m, dt_s);
      } catch (err) {
        refuse(device, err);
        return state;
      }
    },
    pickups(device: ProtectiveDevice): DevicePickups {
      const known = pickups.get(device.id);
      if (known) return known;
      const p: DevicePickups = { phase_A: null, residual_A: null, negative_A: null, overload_A: null };
      const lower = (a: number | null, b: number) => (b > 0 && Number.isFinite(b) && (a === null || b < a) ? b : a);
      try {
        let shortCircuit: number | null = null;
        for (const el of deviceElements(device)) {
          const a = el.pickup_A("nominal");
          if (el.quantity === "residual") p.residual_A = lower(p.residual_A, a);
          else if (el.quantity === "negative") p.negative_A = lower(p.negative_A, a);
          else {
            p.overload_A = lower(p.overload_A, a);
            if (el.id === "short-time" || el.id === "instantaneous") shortCircuit = lower(shortCircuit, a);
          }
        }
        p.phase_A = device.kind === "lvbreaker" && shortCircuit !== null ? shortCircuit : p.overload_A;
      } catch (err) {
        refuse(device, err);
      }
      pickups.set(device.id, p);
      return p;
    },
  };
}
