// Adapter from the protection models to the time-current pane: one tolerance band per device,
// sampled by src/protection's sampleCurve and referred to the plot's voltage.
import type { ProtectiveDevice, Relay, RelayFunction } from "../../../src/model/schema.ts";
import { CURVE_TITLES, FUSE_FAMILY_TITLES, sampleCurve } from "../../../src/protection/index.ts";
import type { CurveQuantity } from "../../../src/protection/index.ts";
import type { TccBand } from "./tccTypes.ts";

export interface DeviceOnPlot {
  device: ProtectiveDevice;
  /** Nominal voltage at the device in kV (its bus). */
  device_kV: number;
}

export interface BandOptions {
  reference_kV: number;
  quantity?: CurveQuantity;
  /** Plot current range, device-side A; defaults are sampleCurve's. */
  iMin_A?: number;
  iMax_A?: number;
  tMin_s?: number;
  tMax_s?: number;
  /** Draw clearing time (trip plus breaker or mechanism time) instead of the trip time. Default true. */
  includeClearing?: boolean;
}

/** The relay function a drag edits: the first enabled inverse-time function on the quantity, else the first enabled one. */
export function dragFunction(relay: Relay, quantity: CurveQuantity = "phase"): RelayFunction | undefined {
  const want = quantity === "ground" ? "residual" : quantity === "negative" ? "negative" : "phase";
  const on = relay.functions.filter((f) => f.enabled && f.quantity === want);
  return on.find((f) => f.curve !== "definite-time") ?? on[0] ?? relay.functions.find((f) => f.enabled);
}

/** One band per device. A device whose settings cannot be drawn throws the protection model's error
 * (it names the device and the field); callers show it instead of the curve. */
export function bandsFromDevices(devices: readonly DeviceOnPlot[], opts: BandOptions): TccBand[] {
  return devices.map(({ device, device_kV }) => {
    const band = sampleCurve(device, {
      quantity: opts.quantity ?? "phase",
      device_kV,
      reference_kV: opts.reference_kV,
      iMin_A: opts.iMin_A,
      iMax_A: opts.iMax_A,
      tMin_s: opts.tMin_s,
      tMax_s: opts.tMax_s,
      includeClearing: opts.includeClearing ?? true,
    });
    const common = { deviceId: device.id, deviceName: device.name || device.id, nominal: band.nominal, min: band.min, max: band.max };
    switch (device.kind) {
      case "relay": {
        const fn = dragFunction(device, opts.quantity);
        const inverse = fn !== undefined && fn.curve !== "definite-time";
        return {
          ...common,
          functionId: fn?.id ?? "",
          functionLabel: fn ? `${fn.ansi} ${CURVE_TITLES[fn.curve]}` : "no enabled function",
          pickup_A: fn?.pickup_A ?? 0,
          multiplier: inverse ? fn.multiplier : undefined,
          draggable: { pickup: fn !== undefined, multiplier: inverse },
        };
      }
      case "fuse":
        return {
          ...common,
          functionId: "fuse",
          functionLabel: device.curve.kind === "parametric" ? `fuse, ${FUSE_FAMILY_TITLES[device.curve.family].replace(/ \(.*\)$/, "").toLowerCase()}` : "fuse, tabulated curve",
          pickup_A: device.rating_A,
          pickupLabel: "rating",
          draggable: { pickup: true },
        };
      case "lvbreaker": {
        const regions = ["LT", device.shortTime ? "ST" : "", device.instantaneous ? "I" : "", device.groundFault ? "G" : ""].filter(Boolean).join("/");
        return {
          ...common,
          functionId: "long-time",
          functionLabel: `LV trip unit ${regions}`,
          pickup_A: device.longTime.ir_x * device.in_A,
          pickupLabel: "Ir",
          draggable: { pickup: true },
        };
      }
    }
  });
}
