// Per-unit conversions on a chosen power base (project.meta.baseMVA) with each bus's nominal voltage
// as its voltage base. Ohm and PerUnit are branded numbers: passing ohms where per-unit is expected
// (or the reverse) fails to compile, which is the bug this guards against.
import type { Project } from "./schema.ts";

declare const unitBrand: unique symbol;
export type Ohm = number & { readonly [unitBrand]: "ohm" };
export type PerUnit = number & { readonly [unitBrand]: "pu" };

/** Marks a plain number as ohms (at the point where it enters from data). */
export const ohm = (value: number): Ohm => value as Ohm;
/** Marks a plain number as per-unit. */
export const pu = (value: number): PerUnit => value as PerUnit;

/** A voltage and power base pair. */
export interface Base {
  u_kV: number;
  s_MVA: number;
}

/** Base impedance Zb = Ub^2 / Sb (kV^2 / MVA = ohm). */
export function zBase_ohm(u_kV: number, s_MVA: number): Ohm {
  assertBase(u_kV, s_MVA);
  return ohm((u_kV * u_kV) / s_MVA);
}

/** Base current Ib = Sb / (sqrt(3) Ub) (MVA / kV = kA). */
export function iBase_kA(u_kV: number, s_MVA: number): number {
  assertBase(u_kV, s_MVA);
  return s_MVA / (Math.sqrt(3) * u_kV);
}

export function ohmToPu(z_ohm: Ohm, u_kV: number, s_MVA: number): PerUnit {
  return pu(z_ohm / zBase_ohm(u_kV, s_MVA));
}

export function puToOhm(z_pu: PerUnit, u_kV: number, s_MVA: number): Ohm {
  return ohm(z_pu * zBase_ohm(u_kV, s_MVA));
}

/** Re-expresses a per-unit impedance on another base: z2 = z1 * (S2/S1) * (U1/U2)^2. */
export function changeBase(z_pu: PerUnit, from: Base, to: Base): PerUnit {
  assertBase(from.u_kV, from.s_MVA);
  assertBase(to.u_kV, to.s_MVA);
  return pu(z_pu * (to.s_MVA / from.s_MVA) * (from.u_kV / to.u_kV) ** 2);
}

/** Equipment impedance given in percent of its own rating (e.g. a transformer's uk) on the system base. */
export function percentOnRatingToPu(z_pct: number, rated: Base, system: Base): PerUnit {
  return changeBase(pu(z_pct / 100), rated, system);
}

/** Voltage base of every bus: its nominal voltage, in kV. */
export function busVoltageBases_kV(project: Project): Map<string, number> {
  const bases = new Map<string, number>();
  for (const e of project.elements) if (e.kind === "bus") bases.set(e.id, e.un_kV);
  return bases;
}

function assertBase(u_kV: number, s_MVA: number): void {
  if (!(u_kV > 0) || !(s_MVA > 0) || !Number.isFinite(u_kV) || !Number.isFinite(s_MVA)) {
    throw new RangeError(`per-unit base must be positive and finite (got ${u_kV} kV, ${s_MVA} MVA)`);
  }
}
