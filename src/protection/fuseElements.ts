// The single time element of a fuse. Band: nominal and min use the melting curve, max the total-clearing curve.
// A fuse does not reset: heat is not assumed to leave the element between fault steps (conservative for the
// fuse itself, stated as a project choice).
import type { Band, CurvePoint, Fuse } from "./types.ts";
import type { TimeElement } from "./timeElement.ts";
import { FUSE_FAMILY_LAWS, familyClear_s, familyMelt_s } from "./fuseFamilies.ts";
import { logLogInterpolate } from "./logLogInterpolate.ts";

export function fuseMelt_s(fuse: Fuse, current_A: number): number {
  const c = fuse.curve;
  if (c.kind === "points") return logLogInterpolate(c.melt as CurvePoint[], current_A);
  return familyMelt_s(FUSE_FAMILY_LAWS[c.family], current_A / fuse.rating_A);
}

export function fuseClear_s(fuse: Fuse, current_A: number): number {
  const c = fuse.curve;
  if (c.kind === "points") return logLogInterpolate(c.clear as CurvePoint[], current_A);
  return familyClear_s(FUSE_FAMILY_LAWS[c.family], current_A / fuse.rating_A);
}

function pickups(fuse: Fuse): { melt: number; clear: number } {
  const c = fuse.curve;
  if (c.kind === "points") return { melt: c.melt[0][0], clear: c.clear[0][0] };
  const law = FUSE_FAMILY_LAWS[c.family];
  return { melt: law.m * fuse.rating_A, clear: law.m * law.clearShift * fuse.rating_A };
}

export function fuseElements(fuse: Fuse): TimeElement[] {
  const p = pickups(fuse);
  const c = fuse.curve;
  const breaks = (band: Band): number[] => {
    if (c.kind === "points") return (band === "max" ? c.clear : c.melt).map((pt) => pt[0]);
    return [band === "max" ? p.clear : p.melt];
  };
  return [
    {
      id: "fuse",
      title: "fuse",
      quantity: "phase",
      pickup_A: (band) => (band === "max" ? p.clear : p.melt),
      time_s: (i, band) => (band === "max" ? fuseClear_s(fuse, i) : fuseMelt_s(fuse, i)),
      reset_s: () => Infinity,
      breakpoints_A: breaks,
      added_s: 0,
      clear_s: (i) => fuseClear_s(fuse, i),
    },
  ];
}
