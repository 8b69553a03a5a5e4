// Constants of the standard inverse-time characteristics.
// IEC 60255-151:2009, Table 1: t = TMS * k / ((I/Is)^a - 1).
// IEEE C37.112-2018, Table 1: t = TD * (A / (M^p - 1) + B); reset t = TD * tr / (1 - M^2).
// The long-time inverse (k 120, a 1) is widely used with the IEC family; whether IEC 60255-151 lists it is unconfirmed.
import type { CurveName } from "../model/schema.ts";

export interface IecConstants {
  family: "iec";
  k: number;
  a: number;
}
export interface IeeeConstants {
  family: "ieee";
  A: number;
  B: number;
  p: number;
  tr: number;
}
export type InverseCurveName = Exclude<CurveName, "definite-time">;

export const CURVE_CONSTANTS: Readonly<Record<InverseCurveName, IecConstants | IeeeConstants>> = {
  "iec-standard-inverse": { family: "iec", k: 0.14, a: 0.02 },
  "iec-very-inverse": { family: "iec", k: 13.5, a: 1 },
  "iec-extremely-inverse": { family: "iec", k: 80, a: 2 },
  "iec-long-time-inverse": { family: "iec", k: 120, a: 1 },
  "ieee-moderately-inverse": { family: "ieee", A: 0.0515, B: 0.114, p: 0.02, tr: 4.85 },
  "ieee-very-inverse": { family: "ieee", A: 19.61, B: 0.491, p: 2, tr: 21.6 },
  "ieee-extremely-inverse": { family: "ieee", A: 28.2, B: 0.1217, p: 2, tr: 29.1 },
};

/** Human names of the curves, as the standards call them. */
export const CURVE_TITLES: Readonly<Record<CurveName, string>> = {
  "iec-standard-inverse": "IEC standard inverse",
  "iec-very-inverse": "IEC very inverse",
  "iec-extremely-inverse": "IEC extremely inverse",
  "iec-long-time-inverse": "IEC long-time inverse",
  "ieee-moderately-inverse": "IEEE moderately inverse",
  "ieee-very-inverse": "IEEE very inverse",
  "ieee-extremely-inverse": "IEEE extremely inverse",
  "definite-time": "Definite time",
};

export function curveFamily(curve: CurveName): "iec" | "ieee" | "definite" {
  return curve === "definite-time" ? "definite" : CURVE_CONSTANTS[curve].family;
}
