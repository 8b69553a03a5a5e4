// What one device sees and does in one fault state: currents, direction, pickup, operating and
// clearing times on the nominal curve and on both edges of its tolerance band.
import type { ProtectiveDevice } from "../model/schema.ts";
import type { DeviceModel } from "./deviceModel.ts";
import { pickupRatioValue } from "./pickupRatio.ts";
import type { DeviceReading } from "./studySolver.ts";
import type { DeviceResponse } from "./types.ts";

const finite = (t: number): number | null => (Number.isFinite(t) ? t : null);

/** A relay with a voltage-restrained (51V) function: its pickup can fall well below the set value. */
function restrained(device: ProtectiveDevice): boolean {
  if (device.kind !== "relay") return false;
  for (const f of device.functions) if (f.restraint) return true;
  return false;
}

export function deviceResponse(device: ProtectiveDevice, reading: DeviceReading | undefined, model: DeviceModel): DeviceResponse {
  const base: DeviceResponse = {
    device: device.id,
    deviceName: device.name ?? "",
    deviceKind: device.kind,
    iPhase_A: 0,
    iResidual_A: 0,
    iNegative_A: 0,
    direction: "none",
    pickedUp: false,
    operatingElement: null,
    tOperate_s: null,
    tClear_s: null,
    tClearMin_s: null,
    tClearMax_s: null,
    role: "none",
    onPathsOf: [],
  };
  if (!reading) return base;
  const { m } = reading;
  base.iPhase_A = Math.max(m.phase_A[0], m.phase_A[1], m.phase_A[2]);
  base.iResidual_A = m.residual_A;
  base.iNegative_A = m.negative_A;
  base.direction = reading.direction;
  if (base.iPhase_A <= 0 && base.iResidual_A <= 0 && base.iNegative_A <= 0) return base;
  // far below every pickup (tolerances and 51V restraint cannot bring it within reach): nothing to time
  if (!restrained(device) && pickupRatioValue(base, model.pickups(device)) < 0.5) return base;
  if (model.operateBands) {
    const t = model.operateBands(device, m);
    base.pickedUp = t.picked;
    if (!Number.isFinite(t.clearing_s)) return base;
    base.operatingElement = t.functionId;
    base.tOperate_s = finite(t.trip_s);
    base.tClear_s = finite(t.clearing_s);
    base.tClearMin_s = finite(t.clearingMin_s);
    base.tClearMax_s = finite(t.clearingMax_s);
    return base;
  }
  const nominal = model.operate(device, m, "nominal");
  base.pickedUp = nominal.picked;
  if (!Number.isFinite(nominal.clearing_s)) return base;
  base.operatingElement = nominal.functionId ?? null;
  base.tOperate_s = finite(nominal.trip_s);
  base.tClear_s = finite(nominal.clearing_s);
  base.tClearMin_s = finite(model.operate(device, m, "min").clearing_s);
  base.tClearMax_s = finite(model.operate(device, m, "max").clearing_s);
  return base;
}
