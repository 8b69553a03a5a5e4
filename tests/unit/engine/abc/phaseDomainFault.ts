// An independent phase-domain (abc) fault solver for small networks, written only to check src/engine.
// It shares no code with the engine: it reads the project records, builds the full phase admittance matrix
// (three nodes per bus, plus winding star points and the fault point) and solves it densely with mathjs.
// Transformers are three single-phase winding pairs wired as the vector group says (a delta winding is a real
// phase-to-phase connection, so the 30-degree shifts come out of the wiring, not out of a table).
// Method: the classic one with every source's internal voltage equal to the prefault voltage, positive sequence,
// no IEC 60909 correction factors, non-motor loads neglected as IEC 60909-0:2016 does.
// Sources: Fortescue 1918 (symmetrical components); modified nodal analysis (Ho, Ruehli, Brennan, IEEE Trans.
// Circuits and Systems 1975) for zero-impedance branches; independent computation with mathjs.
import { add, complex, divide, inv, lusolve, multiply, subtract, type Complex } from "mathjs";
import type { Element, Project, VectorGroup } from "../../../../src/model/schema.ts";
import { type CMatrix, selfMutual, sequenceToPhase } from "./symmetricalComponents.ts";

export type PhaseFaultType = "3ph" | "LL" | "LG" | "LLG";

/** How to turn the records into impedances where conventions differ; defaults follow IEC 60909-0 without correction factors. */
export interface PhaseModelOptions {
  /** Scenario id (out-of-service elements and switch states); none = elements as drawn. */
  scenario?: string;
  /** Which short-circuit power of a grid feeder sets its impedance. */
  gridSk: "max" | "min";
  /** Voltage factor in the grid feeder impedance Z = c Un^2 / S"k (1 = none). */
  gridC: number;
  /** Internal (prefault) voltage of every source, pu. */
  prefault_pu: number;
  /** Generator negative- and zero-sequence resistance: the positive-sequence RG, or rx times x2 / x0. */
  generatorSeqR: "RG" | "rx";
  /** Correction factor on an element's own impedances by id (IEC 60909 KT, KG); earthing impedances stay as they are. */
  impedanceFactor?: Record<string, number>;
  /** Factor on line and cable resistances (conductor temperature for minimum currents). */
  lineResistanceFactor?: number;
  /** Element kinds left out (IEC 60909: motors in minimum calculations). */
  omitKinds?: string[];
  /**
   * Solve by superposition with a flat prefault state instead of with source voltages: the sources become their
   * impedances and the fault branches carry the prefault voltage across them (Thevenin / compensation theorem),
   * every bus assumed at prefault_pu with its vector-group shift before the fault. This is the classic method's and
   * IEC 60909's assumption (equivalent voltage source at the fault) and differs from the source solution only when
   * transformer ratios are off nominal.
   */
  equivalentSource?: boolean;
}

export const DEFAULT_PHASE_OPTIONS: PhaseModelOptions = { gridSk: "max", gridC: 1, prefault_pu: 1, generatorSeqR: "RG" };

export interface PhaseFault {
  /** The faulted bus; with type "none", the bus whose prefault phase a is the angle reference. */
  bus: string;
  /** "none": no fault, only the injections (for transfer impedances). */
  type: PhaseFaultType | "none";
  /** Currents injected into buses, pu of the bus base, as [a, b, c] phasors in the bus's own frame (angle 0 = its
   * prefault phase a) or, with frame "fault", in the faulted bus's frame (as the results are reported). */
  injections?: Array<{ bus: string; phase_pu: Complex[]; frame?: "bus" | "fault" }>;
  /** Fault impedance in ohm: per faulted phase for 3ph (to a common point), between b and c for LL, a to earth for LG,
   * the common point of b and c to earth for LLG. */
  zf_ohm?: { re: number; im: number };
}

export interface PhaseEnd {
  element: string;
  end: "from" | "to" | "terminal";
  bus: string;
  /** Current from the bus into the element, A, per phase. */
  phase_A: Complex[];
}

export interface PhaseSolution {
  /** Phase-to-earth voltages, pu of Un/sqrt(3), angles referred to prefault phase a at the faulted bus. */
  busVoltage_pu: Map<string, Complex[]>;
  /** Current from the network into the fault, kA per phase. */
  fault_kA: Complex[];
  ends: PhaseEnd[];
  /** Positive-sequence phase shift of every bus (degrees) as the wiring produces it, for reference. */
  shift_deg: Map<string, number>;
}

/** Winding wiring of one side: star (neutral brought out or not) or delta; `lead` orders a delta's ends. */
interface SideWiring {
  conn: "Y" | "YN" | "D";
  /** Delta: winding on limb k spans phase k to phase k+lead (mod 3). Star: +1 normal, -1 reversed polarity. */
  lead: 1 | -1;
}

/** Physical wiring of each vector group; the clock number is what this wiring produces (checked in the tests). */
const WIRING: Record<VectorGroup, { hv: SideWiring; lv: SideWiring; clock: number }> = {
  Dyn11: { hv: { conn: "D", lead: 1 }, lv: { conn: "YN", lead: 1 }, clock: 11 },
  Dyn1: { hv: { conn: "D", lead: -1 }, lv: { conn: "YN", lead: 1 }, clock: 1 },
  Dyn5: { hv: { conn: "D", lead: 1 }, lv: { conn: "YN", lead: -1 }, clock: 5 },
  YNd11: { hv: { conn: "YN", lead: 1 }, lv: { conn: "D", lead: -1 }, clock: 11 },
  YNd1: { hv: { conn: "YN", lead: 1 }, lv: { conn: "D", lead: 1 }, clock: 1 },
  Yd11: { hv: { conn: "Y", lead: 1 }, lv: { conn: "D", lead: -1 }, clock: 11 },
  Yd1: { hv: { conn: "Y", lead: 1 }, lv: { conn: "D", lead: 1 }, clock: 1 },
  YNyn0: { hv: { conn: "YN", lead: 1 }, lv: { conn: "YN", lead: 1 }, clock: 0 },
  Yyn0: { hv: { conn: "Y", lead: 1 }, lv: { conn: "YN", lead: 1 }, clock: 0 },
  Yy0: { hv: { conn: "Y", lead: 1 }, lv: { conn: "Y", lead: 1 }, clock: 0 },
  YNy0: { hv: { conn: "YN", lead: 1 }, lv: { conn: "Y", lead: 1 }, clock: 0 },
  Yyn6: { hv: { conn: "Y", lead: 1 }, lv: { conn: "YN", lead: -1 }, clock: 6 },
  Dd0: { hv: { conn: "D", lead: 1 }, lv: { conn: "D", lead: 1 }, clock: 0 },
  Dy11: { hv: { conn: "D", lead: 1 }, lv: { conn: "Y", lead: 1 }, clock: 11 },
};

const GROUND = -1;
const c = (re: number, im = 0) => complex(re, im);
const polar = (abs: number, deg: number) => complex({ r: abs, phi: (deg * Math.PI) / 180 });
const cdiv = (x: Complex, y: Complex) => divide(x, y) as Complex;
const cadd = (x: Complex, y: Complex) => add(x, y) as Complex;
const csub = (x: Complex, y: Complex) => subtract(x, y) as Complex;
const cmul = (x: Complex, y: Complex) => multiply(x, y) as Complex;
/** R + jX from |Z| and R/X. */
const fromRx = (zAbs: number, rx: number) => c((zAbs * rx) / Math.sqrt(1 + rx * rx), zAbs / Math.sqrt(1 + rx * rx));

/** A multiport element: port i is the voltage V[p_i] - V[q_i]; current i_port = Y v_port - J (J drives current into p). */
interface Stamp {
  element: string;
  ports: Array<[number, number]>;
  y: CMatrix;
  j?: Complex[];
}
/** A branch whose current is an unknown (modified nodal analysis): V[p] - V[q] = z I. */
interface MnaBranch {
  element: string;
  p: number;
  q: number;
  z: Complex;
}

function named(e: Element): string {
  return `${e.kind} ${e.id}${"name" in e && e.name ? ` "${e.name}"` : ""}`;
}

/** Solves one fault in the phase domain. Throws on an element kind it does not model (inverters). */
export function phaseDomainFault(project: Project, fault: PhaseFault, options: Partial<PhaseModelOptions> = {}): PhaseSolution {
  const o = { ...DEFAULT_PHASE_OPTIONS, ...options };
  const sBase = project.meta.baseMVA;
  const scenario = o.scenario ? project.scenarios.find((s) => s.id === o.scenario) : undefined;
  if (o.scenario && !scenario) throw new Error(`phaseDomainFault: no scenario "${o.scenario}"`);
  const out = new Set(scenario?.outOfService ?? []);
  const omit = new Set(o.omitKinds ?? []);
  const elements = project.elements.filter((e) => !out.has(e.id) && !omit.has(e.kind));
  const kOf = (id: string) => o.impedanceFactor?.[id] ?? 1;
  const rLine = o.lineResistanceFactor ?? 1;

  // Nodes: three per bus, then star points and the fault point.
  const busIndex = new Map<string, number>();
  const unOf = new Map<string, number>();
  let nNodes = 0;
  for (const e of elements) {
    if (e.kind !== "bus") continue;
    busIndex.set(e.id, nNodes);
    unOf.set(e.id, e.un_kV);
    nNodes += 3;
  }
  const node = (bus: string, k: number) => {
    const i = busIndex.get(bus);
    if (i === undefined) throw new Error(`phaseDomainFault: unknown bus ${bus}`);
    return i + (((k % 3) + 3) % 3);
  };
  const newNode = () => nNodes++;
  const zBase = (bus: string) => (unOf.get(bus) as number) ** 2 / sBase;

  const stamps: Stamp[] = [];
  const branches: MnaBranch[] = [];
  const ends: Array<{ element: string; end: PhaseEnd["end"]; bus: string; nodes: number[] }> = [];

  /** Star point of a winding or machine: ground when solidly earthed, a node with an impedance when earthed through one, floating otherwise. */
  const starPoint = (id: string, earthed: boolean, earthing: { kind: string; z_ohm?: number } | undefined, bus: string): number => {
    if (!earthed || !earthing || earthing.kind === "isolated") return newNode();
    if (earthing.kind === "solid" || !earthing.z_ohm) return GROUND;
    const n = newNode();
    const z = earthing.kind === "resistance" ? c(earthing.z_ohm / zBase(bus)) : c(0, earthing.z_ohm / zBase(bus));
    stamps.push({ element: id, ports: [[n, GROUND]], y: [[cdiv(c(1), z)]] });
    return n;
  };

  /** A three-phase source behind an impedance: ports bus phase k to the star point, Norton current Y E. */
  const source = (e: Element, bus: string, zabc: CMatrix, star: number, emf_pu: number) => {
    const y = inv(zabc) as unknown as CMatrix;
    const eAbc = [0, -120, 120].map((d) => polar(emf_pu, d)); // rotated by the bus shift after the shifts are known
    stamps.push({ element: e.id, ports: [0, 1, 2].map((k) => [node(bus, k), star] as [number, number]), y, j: eAbc });
    ends.push({ element: e.id, end: "terminal", bus, nodes: [0, 1, 2].map((k) => node(bus, k)) });
  };

  for (const e of elements) {
    switch (e.kind) {
      case "bus":
      case "load": // neglected in short-circuit calculations (IEC 60909-0)
      case "relay":
      case "fuse":
      case "lvbreaker":
        break;
      case "grid": {
        const sk = o.gridSk === "max" ? e.skMax_MVA : e.skMin_MVA;
        const z1Abs = (o.gridC * sBase) / sk; // Z = c Un^2 / S"k, in pu of Un^2 / Sbase
        const z1 = fromRx(z1Abs, e.rx);
        const y0 = e.z0z1 === 0 ? c(0) : cdiv(c(1), fromRx(z1Abs * e.z0z1, e.r0x0));
        const y1 = cdiv(c(1), z1);
        const yabc = sequenceToPhase(y0, y1, y1);
        stamps.push({ element: e.id, ports: [0, 1, 2].map((k) => [node(e.bus, k), GROUND] as [number, number]), y: yabc, j: [0, -120, 120].map((d) => polar(o.prefault_pu, d)) });
        ends.push({ element: e.id, end: "terminal", bus: e.bus, nodes: [0, 1, 2].map((k) => node(e.bus, k)) });
        break;
      }
      case "generator": {
        // pu of the machine rating at Ur, referred to the bus base (IEC 60909-0: Z = (R + jX) Ur^2 / Sr).
        const scale = (sBase / e.sr_MVA) * (e.ur_kV / (unOf.get(e.bus) as number)) ** 2 * kOf(e.id);
        const rG = e.rx * e.xdss_pu;
        const z1 = c(rG * scale, e.xdss_pu * scale);
        const z2 = c((o.generatorSeqR === "RG" ? rG : e.rx * e.x2_pu) * scale, e.x2_pu * scale);
        const z0 = c((o.generatorSeqR === "RG" ? rG : e.rx * e.x0_pu) * scale, e.x0_pu * scale);
        const star = starPoint(e.id, true, e.earthing, e.bus);
        source(e, e.bus, sequenceToPhase(z0, z1, z2), star, o.prefault_pu);
        break;
      }
      case "motor": {
        // IEC 60909-0: ZM = (1 / (ILR/IrM)) UrM^2 / SrM, SrM = PrM / (eta cos phi); star not earthed.
        const srM_MVA = e.pr_kW / 1000 / (e.eta * e.cosPhi);
        const zAbs = (1 / e.ilrIr) * (sBase / srM_MVA) * (e.ur_kV / (unOf.get(e.bus) as number)) ** 2;
        const z1 = fromRx(zAbs, e.rx);
        source(e, e.bus, sequenceToPhase(c(1e3, 0), z1, z1), newNode(), o.prefault_pu); // zero sequence blocked by the floating star
        break;
      }
      case "inverter":
        throw new Error(`phaseDomainFault: ${named(e)} is not modelled by the phase-domain reference`);
      case "line": {
        const zb = zBase(e.fromBus);
        const k = e.length_km / e.parallel / zb;
        const z1 = c(e.r1_ohmPerKm * rLine * k, e.x1_ohmPerKm * k);
        const z0 = c(e.r0_ohmPerKm * rLine * k, e.x0_ohmPerKm * k);
        const y = inv(selfMutual(z1, z0)) as unknown as CMatrix;
        stamps.push({ element: e.id, ports: [0, 1, 2].map((p) => [node(e.fromBus, p), node(e.toBus, p)] as [number, number]), y });
        ends.push({ element: e.id, end: "from", bus: e.fromBus, nodes: [0, 1, 2].map((p) => node(e.fromBus, p)) });
        ends.push({ element: e.id, end: "to", bus: e.toBus, nodes: [0, 1, 2].map((p) => node(e.toBus, p)) });
        break;
      }
      case "switch": {
        const closed = scenario?.switchStates[e.id] ?? e.closed;
        if (!closed) break;
        for (let p = 0; p < 3; p++) branches.push({ element: e.id, p: node(e.busA, p), q: node(e.busB, p), z: c(0) });
        break;
      }
      case "transformer":
        transformerStamp(e);
        break;
    }
  }

  function transformerStamp(t: Extract<Element, { kind: "transformer" }>) {
    const w = WIRING[t.vectorGroup];
    // Leakage impedance in pu of Sbase (IEC 60909-0: ZT = uk Ur^2 / (100 Sr), RT = ur Ur^2 / (100 Sr)).
    const zAbs = (((t.uk_pct / 100) * sBase) / t.sr_MVA) * kOf(t.id);
    const r = (((t.ur_pct / 100) * sBase) / t.sr_MVA) * kOf(t.id);
    const z1 = c(r, Math.sqrt(Math.max(0, zAbs * zAbs - r * r)));
    const z0 = multiply(t.z0z1, z1) as Complex;
    // Winding leakage as a coupled 3x3 on the star-equivalent winding base; primitive of the six windings [hv a,b,c, lv a,b,c].
    const yl = inv(selfMutual(z1, z0)) as unknown as CMatrix;
    const y6: CMatrix = [0, 1, 2, 3, 4, 5].map((i) => [0, 1, 2, 3, 4, 5].map((j) => {
      const v = yl[i % 3][j % 3];
      return (i < 3) === (j < 3) ? v : (multiply(-1, v) as Complex);
    }));
    // Winding voltage in pu of its rating = node-difference pu * Un / Ur_winding; a delta winding spans sqrt(3) phase bases.
    const side = (bus: string, wiring: SideWiring, ur_kV: number, earthing: { kind: string; z_ohm?: number }) => {
      const un = unOf.get(bus) as number;
      const ratio = ur_kV / un;
      if (wiring.conn === "D") {
        return { ports: [0, 1, 2].map((k) => [node(bus, k), node(bus, k + wiring.lead)] as [number, number]), t: Math.sqrt(3) * ratio };
      }
      const star = starPoint(t.id, wiring.conn === "YN", earthing, bus);
      return { ports: [0, 1, 2].map((k) => (wiring.lead === 1 ? [node(bus, k), star] : [star, node(bus, k)]) as [number, number]), t: ratio };
    };
    const hv = side(t.hvBus, w.hv, t.urHv_kV * (1 + t.tap_pct / 100), t.earthingHv);
    const lv = side(t.lvBus, w.lv, t.urLv_kV, t.earthingLv);
    const tv = [hv.t, hv.t, hv.t, lv.t, lv.t, lv.t];
    const y = y6.map((row, i) => row.map((v, j) => multiply(v, 1 / (tv[i] * tv[j])) as Complex));
    stamps.push({ element: t.id, ports: [...hv.ports, ...lv.ports], y });
    ends.push({ element: t.id, end: "from", bus: t.hvBus, nodes: [0, 1, 2].map((p) => node(t.hvBus, p)) });
    ends.push({ element: t.id, end: "to", bus: t.lvBus, nodes: [0, 1, 2].map((p) => node(t.lvBus, p)) });
  }

  // Shifts: breadth-first over lines, closed switches and transformers (LV lags HV by clock * 30 degrees).
  const shift = new Map<string, number>();
  const adj = new Map<string, Array<[string, number]>>();
  const link = (a: string, b: string, dAB: number) => {
    if (!adj.has(a)) adj.set(a, []);
    if (!adj.has(b)) adj.set(b, []);
    adj.get(a)?.push([b, dAB]);
    adj.get(b)?.push([a, -dAB]);
  };
  for (const e of elements) {
    if (e.kind === "line") link(e.fromBus, e.toBus, 0);
    if (e.kind === "switch" && (scenario?.switchStates[e.id] ?? e.closed)) link(e.busA, e.busB, 0);
    if (e.kind === "transformer") link(e.hvBus, e.lvBus, -30 * WIRING[e.vectorGroup].clock);
  }
  for (const b of busIndex.keys()) {
    if (shift.has(b)) continue;
    shift.set(b, 0);
    const queue = [b];
    while (queue.length > 0) {
      const x = queue.shift() as string;
      for (const [y, d] of adj.get(x) ?? []) {
        if (!shift.has(y)) {
          shift.set(y, (shift.get(x) as number) + d);
          queue.push(y);
        }
      }
    }
  }
  // Source voltages follow their bus's shift so that the unfaulted network is at rest at prefault_pu everywhere.
  for (const s of stamps) {
    if (!s.j) continue;
    if (o.equivalentSource) {
      s.j = undefined;
      continue;
    }
    const bus = elements.find((e) => e.id === s.element && "bus" in e) as { bus: string };
    const rot = polar(1, shift.get(bus.bus) as number);
    const eRot = s.j.map((v) => multiply(v, rot) as Complex);
    s.j = multiply(s.y, eRot) as unknown as Complex[]; // Norton: J = Y E
  }

  // The fault as a phase-domain connection.
  const fBus = fault.bus;
  if (!busIndex.has(fBus)) throw new Error(`phaseDomainFault: fault bus ${fBus} is not in service`);
  const zf = fault.zf_ohm ? c(fault.zf_ohm.re / zBase(fBus), fault.zf_ohm.im / zBase(fBus)) : c(0);
  const faultBranches: Array<{ phase: number; branch: number }> = [];
  const addFault = (phase: number, p: number, q: number, z: Complex) => {
    faultBranches.push({ phase, branch: branches.length });
    branches.push({ element: "fault", p, q, z });
  };
  if (fault.type === "3ph") {
    const f = newNode();
    for (let k = 0; k < 3; k++) addFault(k, node(fBus, k), f, zf);
    branches.push({ element: "fault-earth", p: f, q: GROUND, z: c(0) }); // a balanced fault: earthing its star changes nothing but fixes the reference
  } else if (fault.type === "LG") {
    addFault(0, node(fBus, 0), GROUND, zf);
  } else if (fault.type === "LL") {
    addFault(1, node(fBus, 1), node(fBus, 2), zf);
  } else if (fault.type === "LLG") {
    const f = newNode();
    addFault(1, node(fBus, 1), f, c(0));
    addFault(2, node(fBus, 2), f, c(0));
    branches.push({ element: "fault-earth", p: f, q: GROUND, z: zf });
  }

  // Assemble [[Y, B], [B^T, -Z]] [V; I] = [J; 0] in real/imaginary arrays, then solve with mathjs.
  const n = nNodes + branches.length;
  const re = Array.from({ length: n }, () => new Float64Array(n));
  const im = Array.from({ length: n }, () => new Float64Array(n));
  const rhsRe = new Float64Array(n);
  const rhsIm = new Float64Array(n);
  const addY = (i: number, j: number, v: Complex, sign: number) => {
    if (i === GROUND || j === GROUND) return;
    re[i][j] += sign * v.re;
    im[i][j] += sign * v.im;
  };
  for (const s of stamps) {
    s.ports.forEach(([pi, qi], i) =>
      s.ports.forEach(([pj, qj], j) => {
        const v = s.y[i][j];
        addY(pi, pj, v, 1);
        addY(pi, qj, v, -1);
        addY(qi, pj, v, -1);
        addY(qi, qj, v, 1);
      }),
    );
    s.j?.forEach((v, i) => {
      const [p, q] = s.ports[i];
      if (p !== GROUND) { rhsRe[p] += v.re; rhsIm[p] += v.im; }
      if (q !== GROUND) { rhsRe[q] -= v.re; rhsIm[q] -= v.im; }
    });
  }
  // Flat prefault voltage of every node (bus phases at prefault_pu with their shift; star and fault points at 0).
  const vPre = new Array<Complex>(nNodes).fill(c(0));
  if (o.equivalentSource) {
    for (const [b, i0] of busIndex) for (let k = 0; k < 3; k++) vPre[i0 + k] = polar(o.prefault_pu, (shift.get(b) as number) - 120 * k);
  }
  const pre = (i: number) => (i === GROUND ? c(0) : vPre[i]);
  for (const inj of fault.injections ?? []) {
    const rot = polar(1, shift.get(inj.frame === "fault" ? fault.bus : inj.bus) as number);
    inj.phase_pu.forEach((v, k) => {
      const vr = cmul(v, rot);
      rhsRe[node(inj.bus, k)] += vr.re;
      rhsIm[node(inj.bus, k)] += vr.im;
    });
  }
  branches.forEach((b, k) => {
    const r = nNodes + k;
    const dv = csub(pre(b.p), pre(b.q));
    rhsRe[r] = -dv.re;
    rhsIm[r] = -dv.im;
    if (b.p !== GROUND) { re[b.p][r] += 1; re[r][b.p] += 1; }
    if (b.q !== GROUND) { re[b.q][r] -= 1; re[r][b.q] -= 1; }
    re[r][r] -= b.z.re;
    im[r][r] -= b.z.im;
  });
  const A = re.map((row, i) => Array.from(row, (x, j) => c(x, im[i][j])));
  const bVec = Array.from(rhsRe, (x, i) => c(x, rhsIm[i]));
  const x = (lusolve(A, bVec) as unknown as Complex[][]).map((r) => r[0]);
  const V = (i: number) => (i === GROUND ? c(0) : cadd(x[i], vPre[i]));

  // Results, rotated so that prefault phase a at the faulted bus is the angle reference.
  const rot = polar(1, -(shift.get(fBus) as number));
  const r = (v: Complex) => multiply(v, rot) as Complex;
  const baseA = (bus: string) => (sBase * 1e3) / (Math.sqrt(3) * (unOf.get(bus) as number)); // A per pu
  const busVoltage_pu = new Map<string, Complex[]>();
  for (const b of busIndex.keys()) busVoltage_pu.set(b, [0, 1, 2].map((k) => r(V(node(b, k)))));
  const fault_kA = [c(0), c(0), c(0)];
  for (const { phase, branch } of faultBranches) fault_kA[phase] = multiply(r(x[nNodes + branch]), baseA(fBus) / 1000) as Complex;
  if (fault.type === "LL") fault_kA[2] = multiply(-1, fault_kA[1]) as Complex; // the b-c branch returns through c

  // Current into each element at each of its nodes: sum over ports of +/- (Y v - J).
  const into = new Map<string, Map<number, Complex>>();
  const addInto = (el: string, nodeIx: number, v: Complex) => {
    if (nodeIx === GROUND) return;
    if (!into.has(el)) into.set(el, new Map());
    const m = into.get(el) as Map<number, Complex>;
    m.set(nodeIx, cadd(m.get(nodeIx) ?? c(0), v));
  };
  for (const s of stamps) {
    // Currents from the change of voltage only: with a flat prefault state there is no prefault current.
    const dV = (i: number) => (i === GROUND ? c(0) : x[i]);
    const vPort = s.ports.map(([p, q]) => csub(dV(p), dV(q)));
    s.ports.forEach(([p, q], i) => {
      let iPort = c(0);
      for (let j = 0; j < vPort.length; j++) iPort = cadd(iPort, cmul(s.y[i][j], vPort[j]));
      if (s.j) iPort = csub(iPort, s.j[i]);
      addInto(s.element, p, iPort);
      addInto(s.element, q, multiply(-1, iPort) as Complex);
    });
  }
  const phaseEnds: PhaseEnd[] = ends.map((e) => ({
    element: e.element,
    end: e.end,
    bus: e.bus,
    phase_A: e.nodes.map((nd) => multiply(r(into.get(e.element)?.get(nd) ?? c(0)), baseA(e.bus)) as Complex),
  }));
  for (const e of elements) {
    if (e.kind !== "switch") continue;
    const ix = branches.map((b, k) => (b.element === e.id ? k : -1)).filter((k) => k >= 0);
    if (ix.length === 0) continue;
    phaseEnds.push({ element: e.id, end: "from", bus: e.busA, phase_A: ix.map((k) => multiply(r(x[nNodes + k]), baseA(e.busA)) as Complex) });
    phaseEnds.push({ element: e.id, end: "to", bus: e.busB, phase_A: ix.map((k) => multiply(r(x[nNodes + k]), -baseA(e.busB)) as Complex) });
  }
  const shift_deg = new Map<string, number>();
  for (const [b, d] of shift) shift_deg.set(b, d - (shift.get(fBus) as number));
  return { busVoltage_pu, fault_kA, ends: phaseEnds, shift_deg };
}

