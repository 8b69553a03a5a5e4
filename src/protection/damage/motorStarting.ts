// Motor starting curve: locked-rotor current for the starting time, then rated current; plus the hot-stall point.
import type { CurvePoint, Polyline } from "../types.ts";

export interface MotorStartingInput {
  ratedCurrent_A: number;
  /** Locked-rotor current in multiples of rated current. */
  ilrIr: number;
  start_s: number;
  /** Safe stall time from hot, s (motor damage point), when known. */
  hotStall_s?: number;
  /** Top of the drawn curve, s. Default 1000. */
  tTop_s?: number;
  /** Earliest drawn time, s. Default 0.01. */
  tBottom_s?: number;
}

export interface MotorStarting {
  /** [A, s]: locked-rotor current from tBottom to start_s, then rated current up to tTop. */
  curve: Polyline;
  /** Locked-rotor current at the safe hot-stall time; absent when hotStall_s is not given. */
  hotStall?: CurvePoint;
  /** Protection must stay above the curve and below the hot-stall point. */
  warning?: string;
}

export function motorStarting(input: MotorStartingInput): MotorStarting {
  const { ratedCurrent_A: ir, ilrIr, start_s } = input;
  if (!(ir > 0) || !(ilrIr > 1) || !(start_s > 0)) {
    throw new RangeError(`motor starting needs ratedCurrent_A > 0, ilrIr > 1, start_s > 0 (got ${ir}, ${ilrIr}, ${start_s})`);
  }
  const ilr = ir * ilrIr;
  const top = input.tTop_s ?? 1000;
  const bottom = input.tBottom_s ?? 0.01;
  const curve: Polyline = [
    [ilr, bottom],
    [ilr, start_s],
    [ir, start_s],
    [ir, Math.max(top, start_s)],
  ];
  if (input.hotStall_s === undefined) return { curve };
  const hotStall: CurvePoint = [ilr, input.hotStall_s];
  const warning = input.hotStall_s <= start_s ? `hot-stall time ${input.hotStall_s} s is not above the starting time ${start_s} s: no setting can both start and protect the motor` : undefined;
  return warning ? { curve, hotStall, warning } : { curve, hotStall };
}
