// Overload protection of a conductor, IEC 60364-4-43:2008, 433.1: the device protects the cable
// against overload when IB <= In <= IZ (433.1, a) and I2 <= 1.45 IZ (433.1, b), with IB the design
// current of the circuit, In the device's rated current (its set current Ir for an adjustable
// release), IZ the conductor's continuous current-carrying capacity and I2 the current that ensures
// the device operates within the conventional time. Pure: the numbers in, the finding out.
import type { Fuse, LvBreaker } from "../model/schema.ts";

export interface LvOverloadInput {
  /** Design current IB of the circuit in A; undefined when not known (that part is then not judged). */
  design_A?: number;
  /** Rated current In of the device, or its set current Ir for an adjustable release, in A. */
  rated_A: number;
  /** Conventional tripping (or fusing) current I2 in A. */
  conventionalTrip_A: number;
  /** Continuous current-carrying capacity IZ of the conductor in A (all parallel runs). */
  ampacity_A: number;
}

export type LvOverloadProblem = "design-above-rated" | "rated-above-ampacity" | "conventional-above-limit";

export interface LvOverloadFinding {
  ok: boolean;
  /** 1.45 IZ in A: the most I2 may be. */
  limit_A: number;
  /** null when the design current is not known. */
  designWithinRated: boolean | null;
  ratedWithinAmpacity: boolean;
  conventionalWithinLimit: boolean;
  problems: LvOverloadProblem[];
  /** One sentence per problem, with the figures. */
  texts: string[];
}

/** Ratio I2 / IZ may reach (IEC 60364-4-43:2008, 433.1, condition b). */
export const CONVENTIONAL_LIMIT_FACTOR = 1.45;

function fmtA(a: number): string {
  return `${Number(a.toPrecision(4))} A`;
}

export function checkLvOverload(input: LvOverloadInput): LvOverloadFinding {
  const { design_A, rated_A, conventionalTrip_A, ampacity_A } = input;
  for (const [name, v] of [
    ["rated_A", rated_A],
    ["conventionalTrip_A", conventionalTrip_A],
    ["ampacity_A", ampacity_A],
  ] as const) {
    if (!(Number.isFinite(v) && v > 0)) throw new RangeError(`checkLvOverload: ${name} must be a positive number (got ${String(v)})`);
  }
  if (design_A !== undefined && !(Number.isFinite(design_A) && design_A >= 0)) throw new RangeError(`checkLvOverload: design_A must be a number >= 0 (got ${String(design_A)})`);
  const limit_A = CONVENTIONAL_LIMIT_FACTOR * ampacity_A;
  const designWithinRated = design_A === undefined ? null : design_A <= rated_A;
  const ratedWithinAmpacity = rated_A <= ampacity_A;
  const conventionalWithinLimit = conventionalTrip_A <= limit_A;
  const problems: LvOverloadProblem[] = [];
  const texts: string[] = [];
  if (designWithinRated === false) {
    problems.push("design-above-rated");
    texts.push(`design current IB ${fmtA(design_A as number)} is above the device's rated or set current In ${fmtA(rated_A)}`);
  }
  if (!ratedWithinAmpacity) {
    problems.push("rated-above-ampacity");
    texts.push(`rated or set current In ${fmtA(rated_A)} is above the conductor's ampacity IZ ${fmtA(ampacity_A)}`);
  }
  if (!conventionalWithinLimit) {
    problems.push("conventional-above-limit");
    texts.push(`conventional tripping current I2 ${fmtA(conventionalTrip_A)} is above 1.45 IZ = ${fmtA(limit_A)}`);
  }
  return { ok: problems.length === 0, limit_A, designWithinRated, ratedWithinAmpacity, conventionalWithinLimit, problems, texts };
}

/** I2 / Ir of an LV breaker's inverse-time release: IEC 60947-2, Table 6 (conventional tripping current
 * 1.30 times the current setting, at the reference temperature); the project's LV bands keep the
 * long-time pickup inside 1.05-1.30 Ir accordingly. // from memory */
export const BREAKER_CONVENTIONAL_FACTOR = 1.3;
/** I2 / In of a gG fuse of 16 A and more: IEC 60269-1, Table 2 (conventional fusing current 1.6 In). // from memory */
export const FUSE_CONVENTIONAL_FACTOR = 1.6;

/** The set current (Ir for a breaker, In for a fuse) and the conventional tripping current of a device. */
export function deviceOverloadCurrents(device: LvBreaker | Fuse): { rated_A: number; conventionalTrip_A: number } {
  if (device.kind === "lvbreaker") {
    const ir_A = device.in_A * device.longTime.ir_x;
    return { rated_A: ir_A, conventionalTrip_A: BREAKER_CONVENTIONAL_FACTOR * ir_A };
  }
  return { rated_A: device.rating_A, conventionalTrip_A: FUSE_CONVENTIONAL_FACTOR * device.rating_A };
}
