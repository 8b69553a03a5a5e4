// Random small networks (3-8 buses, radial or meshed) for comparing the engine with the phase-domain reference.
// Impedances are drawn within plausible ranges for an 11 kV / 0.4 kV site (// common practice orders of magnitude).
// Restrictions that keep both solutions about the same physics:
// - transformer rated voltages equal the bus voltages and taps are 0, so the unfaulted network is at rest at 1 pu
//   everywhere and the classic method's flat prefault voltage is the physical one (the offNominal variant drops
//   this and is compared by superposition on a flat prefault state instead);
// - ties join buses of the same voltage and the same vector-group shift (no circulating prefault current);
// - every part of the network has an earth reference (an LV star behind a transformer is earthed), because the
//   phase-domain reference has no magnetising branch to fix a floating zero-sequence voltage; a Yyn0 transformer
//   therefore always comes with an earthed generator on its LV bus;
// - no inverters (their current limits are not part of this comparison).
// Also drawn: bus couplers (closed switches), open tie switches, an islanded scenario (feeder out, a standby
// generator at the main bus), a generator taken out of service, relays at branch ends, and faults along lines.
import fc from "fast-check";
import type { Project } from "../../../../src/model/schema.ts";
import type { PhaseFaultType } from "./phaseDomainFault.ts";
import { miniProject } from "./miniProject.ts";

export type SmallLocation = { kind: "bus"; bus: string } | { kind: "line"; line: string; pct: number };

export interface SmallCase {
  project: Project;
  location: SmallLocation;
  /** The bus whose voltage base applies to the fault (the line's from bus for a fault along a line). */
  faultBus: string;
  type: PhaseFaultType;
  zf_ohm: { re: number; im: number };
  meshed: boolean;
  seed: number;
}

function rng(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const GROUPS = [
  { vg: "Dyn11", clock: 11 },
  { vg: "Dyn1", clock: 1 },
  { vg: "Dyn5", clock: 5 },
  { vg: "YNyn0", clock: 0 },
  { vg: "Yyn0", clock: 0 },
] as const;
const TYPES: PhaseFaultType[] = ["3ph", "LL", "LG", "LLG"];

/** Builds one small case from a seed (the seed alone reproduces a failing case). */
export function smallCase(seed: number, meshed: boolean, offNominal = false): SmallCase {
  const r = rng(seed);
  const u = (lo: number, hi: number) => lo + (hi - lo) * r();
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(r() * xs.length)];
  const n = 3 + Math.floor(r() * 6);
  const el: Array<Record<string, unknown>> = [];
  const un: number[] = [11];
  const shift: number[] = [0];
  el.push({ kind: "bus", id: "B0", name: "Bus 0", un_kV: 11 });
  el.push({ kind: "grid", id: "Q", name: "Feeder", bus: "B0", skMax_MVA: u(50, 500), skMin_MVA: 40, rx: u(0.05, 0.3), z0z1: u(0.5, 3), r0x0: u(0.05, 0.5) });
  const earthing = (allowIsolated: boolean) => {
    const k = pick(allowIsolated ? ["solid", "resistance", "reactance", "isolated"] : ["solid", "resistance", "reactance"]);
    return k === "solid" || k === "isolated" ? { kind: k } : { kind: k, z_ohm: u(0.5, 40) };
  };
  const line = (id: string, a: number, b: number) => {
    const r1 = u(0.05, 0.6);
    const x1 = u(0.07, 0.4);
    const lv = un[a] < 1;
    el.push({
      kind: "line", id, name: `Cable ${id}`, fromBus: `B${a}`, toBus: `B${b}`, length_km: lv ? u(0.01, 0.3) : u(0.05, 3),
      r1_ohmPerKm: r1, x1_ohmPerKm: x1, r0_ohmPerKm: r1 * u(1.5, 4), x0_ohmPerKm: x1 * u(2, 4), parallel: r() < 0.2 ? 2 : 1, csa_mm2: 150, ampacity_A: 300,
    });
  };
  const generator = (id: string, bus: number, earth: Record<string, unknown>) => {
    el.push({
      kind: "generator", id, name: `Generator ${id}`, bus: `B${bus}`, sr_MVA: un[bus] < 1 ? u(0.1, 1) : u(0.5, 5), ur_kV: un[bus],
      xdss_pu: u(0.1, 0.25), x2_pu: u(0.1, 0.3), x0_pu: u(0.03, 0.1), rx: u(0.05, 0.2), earthing: earth,
    });
  };
  const lines: string[] = [];
  const branches: string[] = [];
  for (let i = 1; i < n; i++) {
    const parent = Math.floor(r() * i);
    el.push({ kind: "bus", id: `B${i}`, name: `Bus ${i}`, un_kV: 0 }); // voltage filled below
    const busRec = el[el.length - 1];
    if (un[parent] > 1 && r() < 0.45) {
      const g = pick(GROUPS);
      un.push(0.4);
      shift.push(shift[parent] - 30 * g.clock);
      const uk = u(4, 10);
      el.push({
        kind: "transformer", id: `T${i}`, name: `Transformer ${i}`, hvBus: `B${parent}`, lvBus: `B${i}`, sr_MVA: u(0.1, 5), urHv_kV: 11, urLv_kV: 0.4,
        uk_pct: uk, ur_pct: u(0.3, 1.5), vectorGroup: g.vg, z0z1: u(0.7, 1), earthingHv: earthing(false), earthingLv: earthing(false), tap_pct: 0,
      });
      if (offNominal) {
        // Rated voltages off the bus voltages and an off-load tap (compared by superposition, see the tests).
        Object.assign(el[el.length - 1], { urHv_kV: pick([10.5, 11, 11.5]), urLv_kV: pick([0.4, 0.41, 0.42]), tap_pct: Math.round(u(-5, 5) * 2) / 2 });
      }
      branches.push(`T${i}`);
      if (g.vg === "Yyn0") generator(`M${i}`, i, earthing(false));
    } else if (r() < 0.15) {
      un.push(un[parent]);
      shift.push(shift[parent]);
      el.push({ kind: "switch", id: `S${i}`, name: `Coupler ${i}`, device: "breaker", busA: `B${parent}`, busB: `B${i}`, closed: true });
    } else {
      un.push(un[parent]);
      shift.push(shift[parent]);
      line(`L${i}`, parent, i);
      lines.push(`L${i}`);
      branches.push(`L${i}`);
    }
    busRec.un_kV = un[i];
  }
  if (meshed) {
    const ties = 1 + Math.floor(r() * 2);
    for (let k = 0; k < ties; k++) {
      const a = Math.floor(r() * n);
      // Possibly across a closed coupler: a cable whose two ends are one node is a case of its own.
      const same = [...Array(n).keys()].filter((b) => b !== a && un[b] === un[a] && ((shift[b] - shift[a]) % 360 + 360) % 360 === 0);
      if (same.length === 0) continue;
      const b = pick(same);
      if (r() < 0.25) {
        el.push({ kind: "switch", id: `X${k}`, name: `Tie switch ${k}`, device: "switch", busA: `B${a}`, busB: `B${b}`, closed: false });
      } else {
        line(`X${k}`, a, b);
        lines.push(`X${k}`);
        branches.push(`X${k}`);
      }
    }
  }
  // A few more sources: generators on MV or LV buses, a motor on an LV bus.
  for (let k = 0; k < 2; k++) if (r() < 0.5) generator(`G${k}`, Math.floor(r() * n), earthing(true));
  const lvBuses = [...Array(n).keys()].filter((b) => un[b] < 1);
  if (lvBuses.length > 0 && r() < 0.5) {
    el.push({ kind: "motor", id: "MOT", name: "Pump motor", bus: `B${pick(lvBuses)}`, pr_kW: u(20, 300), ur_kV: 0.4, eta: 0.94, cosPhi: 0.86, ilrIr: u(5, 7), rx: 0.42 });
  }
  if (r() < 0.5) el.push({ kind: "load", id: "LD", name: "Load", bus: `B${Math.floor(r() * n)}`, p_kW: 100, q_kvar: 30 });
  // Scenario: as drawn, islanded on a standby generator, or with one generator out of service.
  const scenario: { outOfService: string[] } = { outOfService: [] };
  const gens = el.filter((e) => e.kind === "generator").map((e) => e.id as string).filter((id) => !id.startsWith("M"));
  const mode = r();
  if (mode < 0.25) {
    generator("SG", 0, { kind: "resistance", z_ohm: u(5, 40) });
    scenario.outOfService.push("Q");
  } else if (mode < 0.4 && gens.length > 0) {
    scenario.outOfService.push(pick(gens));
  }
  // Relays at branch ends (their currents are what the sweep keeps).
  branches.forEach((b, k) => {
    if (r() < 0.7) el.push({ kind: "relay", id: `R${k}`, name: `Relay ${k}`, at: { element: b, end: r() < 0.7 ? "from" : "to" }, ctPrimary_A: 400, functions: [] });
  });
  const type = pick(TYPES);
  let location: SmallLocation;
  let fb: number;
  if (lines.length > 0 && r() < 0.3) {
    const id = pick(lines);
    const rec = el.find((e) => e.id === id) as { fromBus: string };
    fb = Number(rec.fromBus.slice(1));
    location = { kind: "line", line: id, pct: Math.round(u(1, 99) * 100) / 100 };
  } else {
    fb = Math.floor(r() * n);
    location = { kind: "bus", bus: `B${fb}` };
  }
  const faultBus = `B${fb}`;
  // Half the faults bolted, half through up to 0.3 pu of the fault bus's impedance base (mostly resistive).
  const zb = (un[fb] * un[fb]) / 100;
  const zf_ohm = r() < 0.5 ? { re: 0, im: 0 } : { re: u(0, 0.3) * zb, im: u(0, 0.1) * zb };
  const project = miniProject(el, { method: "classic", prefault_pu: 1, faultR_ohm: zf_ohm.re, faultX_ohm: zf_ohm.im }, scenario);
  return { project, location, faultBus, type, zf_ohm, meshed, seed };
}

/** fast-check arbitrary of small cases; the seed is part of the value, so a counterexample can be rebuilt. */
export const smallCaseArbitrary = (meshed: boolean, offNominal = false) => fc.integer({ min: 0, max: 2 ** 31 - 1 }).map((seed) => smallCase(seed, meshed, offNominal));
