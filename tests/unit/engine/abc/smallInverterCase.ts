// A small random case (see smallNetworkArbitrary.ts) with one to three inverters added at random buses.
import { projectSchema, type Project } from "../../../../src/model/schema.ts";
import { smallCase, type SmallCase } from "./smallNetworkArbitrary.ts";

export interface InverterCase {
  base: SmallCase;
  project: Project;
  /** A random bus to fault. */
  bus: string;
  seed: number;
}

/** `mix`: also grid-forming units and negative-sequence control; otherwise grid-following units without it. */
export function smallInverterCase(seed: number, mix = false): InverterCase {
  const base = smallCase(seed, seed % 2 === 0);
  let s = seed >>> 0;
  const r = () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0; // LCG, enough to place a few units
    return s / 4294967296;
  };
  const buses = base.project.elements.flatMap((e) => (e.kind === "bus" ? [e] : []));
  const units = 1 + Math.floor(r() * 3);
  const extra = Array.from({ length: units }, (_, i) => {
    const b = buses[Math.floor(r() * buses.length)];
    const forming = mix && r() < 0.3;
    return {
      kind: "inverter", id: `PV${i}`, name: `PV ${i}`, bus: b.id, sr_MVA: b.un_kV < 1 ? 0.05 + r() * 0.5 : 0.5 + r() * 2, ur_kV: b.un_kV,
      iMax_pu: 1.1 + r() * 0.4, control: forming ? "grid-forming" : "grid-following", kFactor: 2 + r() * 2,
      negSeq: { mode: mix && r() < 0.5 ? "k-factor" : "none", k2: 2 + r() * 2 }, activePower_pu: r(),
    };
  });
  const project = projectSchema.parse({ ...base.project, elements: [...base.project.elements, ...extra] });
  return { base, project, bus: buses[Math.floor(r() * buses.length)].id, seed };
}
