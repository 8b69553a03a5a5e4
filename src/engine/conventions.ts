// The choices the engine makes where IEC 60909-0:2016 leaves one (or where Islet goes beyond it), in words, for the
// report's assumptions and README. Each sentence states what the code does; tests/unit/engine/conventions.test.ts
// checks them against the engine's figures.
import type { Method } from "./types.ts";

export interface EngineConvention {
  topic: string;
  text: string;
}

export function engineConventions(method: Method): EngineConvention[] {
  const iec = method === "iec60909";
  return [
    {
      topic: "Peak current with converters",
      text:
        "The peak factor kappa (radial sum of partial peaks, or method B in a meshed island) applies to the voltage sources' share of I\"k only; " +
        "full-size converters, grid-forming units included, add their share with kappa = 1 (a controlled current with no decaying " +
        "d.c. component; IEC 60909-0:2016, 8.1, as recalled, not checked against the document): ip = √2 (I\"k + (kappa − 1) I\"k,S), where I\"k,S is the same fault in " +
        "the network without any converter. With the IEC converter model the shares are in phase, so ip = kappa √2 I\"k,S + √2 I\"kPF. " +
        "The thermal factor m uses the same kappa on the whole I\"k (conservative).",
    },
    {
      topic: "Generator negative and zero sequence",
      text:
        "The subtransient R/X (rx) also gives the resistance of x(2) and x(0); the correction factor (KG, or the power station " +
        "unit's factor) scales Z(2) and Z(0) as it does Z\"d, but not the neutral earthing impedance 3 ZN.",
    },
    {
      topic: "Motors at the minimum limit",
      text: iec ? "Asynchronous motors are left out of the minimum short-circuit currents and kept in the maximum ones." : "The classic method keeps motors at both limits.",
    },
    {
      topic: "Converters at the minimum limit",
      text: "Converters feed the minimum currents as they do the maximum ones: the same current limit and, in the refined model, the same control.",
    },
    {
      topic: "Correction factors at the minimum limit",
      text: iec
        ? "KT, KG and the power station unit factors are computed with cmax at both limits (cmin enters only the equivalent voltage source and the feeder impedance ZQ = c UnQ² / S\"kQ)."
        : "The classic method applies no correction factors.",
    },
    {
      topic: "Transformer tap",
      text:
        "The off-load tap changes the ideal ratio on the HV side, t = UrHV (1 + tap) / UnHV ÷ (UrLV / UnLV); the impedance, from uk and ur at " +
        "rated voltages, is referred to the LV side and does not change with the tap.",
    },
    {
      topic: "Conductor temperature",
      text: iec
        ? "Line and cable resistances (R1 and R0) are taken at 20 °C for maximum currents and at the end-of-fault temperature for minimum currents, R = R20 (1 + 0.004/K (θe − 20 °C)); reactances do not change."
        : "The classic method takes line and cable resistances at 20 °C at both limits.",
    },
  ];
}
