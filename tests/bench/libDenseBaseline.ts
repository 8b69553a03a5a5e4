// The yardstick for the engine's speed: a plain dense positive-sequence solution with mathjs, built straight from
// the project records (grid feeders, generators, motors, lines, transformers at nominal ratio; loads and inverters
// left out) and solved with lusolve for one faulted bus. Used for timing, and its three-phase current as a sanity figure.
import { add, complex, divide, lusolve, subtract, type Complex } from "mathjs";
import type { Project } from "../../src/model/schema.ts";

export interface DenseFault {
  ik_kA: number;
  build_ms: number;
  solve_ms: number;
}

export function denseThreePhaseFault(project: Project, faultBus: string): DenseFault {
  const t0 = performance.now();
  const sBase = project.meta.baseMVA;
  const index = new Map<string, number>();
  const un = new Map<string, number>();
  for (const e of project.elements) if (e.kind === "bus") { index.set(e.id, index.size); un.set(e.id, e.un_kV); }
  const n = index.size;
  const zero = complex(0, 0);
  const Y: Complex[][] = Array.from({ length: n }, () => Array.from({ length: n }, () => zero));
  const inv = (re: number, im: number) => divide(complex(1, 0), complex(re, im)) as Complex;
  const shunt = (bus: string, y: Complex) => {
    const i = index.get(bus) as number;
    Y[i][i] = add(Y[i][i], y) as Complex;
  };
  const series = (a: string, b: string, y: Complex) => {
    const i = index.get(a) as number;
    const j = index.get(b) as number;
    Y[i][i] = add(Y[i][i], y) as Complex;
    Y[j][j] = add(Y[j][j], y) as Complex;
    Y[i][j] = subtract(Y[i][j], y) as Complex;
    Y[j][i] = subtract(Y[j][i], y) as Complex;
  };
  for (const e of project.elements) {
    if (e.kind === "grid") {
      const z = sBase / e.skMax_MVA;
      shunt(e.bus, inv((z * e.rx) / Math.hypot(1, e.rx), z / Math.hypot(1, e.rx)));
    } else if (e.kind === "generator") {
      const k = (sBase / e.sr_MVA) * (e.ur_kV / (un.get(e.bus) as number)) ** 2;
      shunt(e.bus, inv(e.rx * e.xdss_pu * k, e.xdss_pu * k));
    } else if (e.kind === "motor") {
      const z = (1 / e.ilrIr) * (sBase / (e.pr_kW / 1000 / (e.eta * e.cosPhi))) * (e.ur_kV / (un.get(e.bus) as number)) ** 2;
      shunt(e.bus, inv((z * e.rx) / Math.hypot(1, e.rx), z / Math.hypot(1, e.rx)));
    } else if (e.kind === "line") {
      const k = e.length_km / e.parallel / ((un.get(e.fromBus) as number) ** 2 / sBase);
      series(e.fromBus, e.toBus, inv(e.r1_ohmPerKm * k, e.x1_ohmPerKm * k));
    } else if (e.kind === "transformer") {
      const z = ((e.uk_pct / 100) * sBase) / e.sr_MVA;
      const r = ((e.ur_pct / 100) * sBase) / e.sr_MVA;
      series(e.hvBus, e.lvBus, inv(r, Math.sqrt(Math.max(0, z * z - r * r))));
    }
  }
  const k = index.get(faultBus);
  if (k === undefined) throw new Error(`denseThreePhaseFault: no bus ${faultBus}`);
  const rhs = Array.from({ length: n }, (_, i) => (i === k ? complex(1, 0) : zero));
  const t1 = performance.now();
  const x = lusolve(Y, rhs) as unknown as Complex[][];
  const zkk = x[k][0];
  const t2 = performance.now();
  const ik_pu = 1 / Math.hypot(zkk.re, zkk.im);
  const ik_kA = (ik_pu * sBase) / (Math.sqrt(3) * (un.get(faultBus) as number));
  return { ik_kA, build_ms: t1 - t0, solve_ms: t2 - t1 };
}
