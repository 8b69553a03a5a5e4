// Number and name formatting shared by the verdict explanations.
import type { ProtectiveDevice } from "../../model/schema.ts";

export const fmtS = (t: number | null): string => (t === null ? "never" : `${t.toFixed(2)} s`);
/** Three decimals, for times compared with a limit they may sit close to. */
export const fmtS3 = (t: number | null): string => (t === null ? "never" : `${t.toFixed(3)} s`);
export const fmtA = (i: number): string => (i >= 1000 ? `${(i / 1000).toFixed(2)} kA` : `${i.toFixed(0)} A`);
export const fmtX = (x: number): string => `${x < 10 ? x.toFixed(3) : x.toFixed(1)} x`;

/** `R-T1-HV 51` for a relay operating through a function, `F-7` for a fuse. */
export function deviceTag(device: ProtectiveDevice | undefined, id: string, functionId: string | null = null): string {
  if (device?.kind === "relay" && functionId) {
    const fn = device.functions.find((f) => f.id === functionId);
    if (fn) return `${id} ${fn.ansi}`;
  }
  return id;
}

/** Rounds figures kept in a verdict's numbers so that JSON output stays readable. */
export function round(x: number, digits = 4): number {
  if (!Number.isFinite(x)) return x;
  const k = 10 ** digits;
  return Math.round(x * k) / k;
}
