// The I"k magnitude reported for each fault type, and the largest faulted-phase current.
import type { Cx } from "../network/model.ts";
import type { FaultType } from "../types.ts";
import { seqToPhase } from "./phasors.ts";

export function faultMagnitudes(type: FaultType, i: [Cx, Cx, Cx]): { ikss: number; maxPhase: number; earth: number } {
  const ph = seqToPhase(i);
  const mags = ph.map((p) => Math.hypot(p.re, p.im));
  const earth = 3 * Math.hypot(i[0].re, i[0].im);
  const maxPhase = Math.max(...mags);
  switch (type) {
    case "3ph":
      return { ikss: Math.hypot(i[1].re, i[1].im), maxPhase, earth };
    case "LL":
      return { ikss: mags[1], maxPhase, earth };
    case "LG":
    case "LLG":
      return { ikss: earth, maxPhase, earth };
  }
}
