// Transformer magnetising inrush point: about 12 x rated current for 0.1 s (8-12 x in use). // common practice
import type { CurvePoint } from "../types.ts";

export const INRUSH_MULTIPLE = 12;
export const INRUSH_DURATION_S = 0.1;

export function inrushPoint(ratedCurrent_A: number, multiple = INRUSH_MULTIPLE, duration_s = INRUSH_DURATION_S): CurvePoint {
  if (!(ratedCurrent_A > 0) || !(multiple > 0) || !(duration_s > 0)) {
    throw new RangeError(`inrush point needs positive rated current, multiple and duration (got ${ratedCurrent_A}, ${multiple}, ${duration_s})`);
  }
  return [ratedCurrent_A * multiple, duration_s];
}
