import type { LoadFlowResult, LocationCurrent } from "../types.ts";

/** Load current in A at every branch end and shunt terminal. */
export function loadCurrents(result: LoadFlowResult): LocationCurrent[] {
  const out: LocationCurrent[] = [];
  for (const b of result.branches) {
    out.push({ element: b.element, end: "from", bus: b.from.bus, i_A: b.from.i_A });
    out.push({ element: b.element, end: "to", bus: b.to.bus, i_A: b.to.i_A });
  }
  for (const s of result.shunts) out.push({ element: s.element, end: "terminal", bus: s.bus, i_A: s.i_A });
  return out;
}
