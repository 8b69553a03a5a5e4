// The time-current plot of one protection path: every device of the path (phase quantity, clearing time
// with tolerance band), the withstand of the equipment the devices look into, motor starting, transformer
// inrush, and the largest and smallest fault current through the primary device. Currents are referred
// to the primary device's voltage.
import { isProtectiveDevice, type Element, type Project, type ProtectiveDevice } from "../model/schema.ts";
import {
  cableK,
  cableWithstandCurve,
  inrushPoint,
  motorStarting,
  referScale,
  sampleCurve,
  transformerWithstand,
  type CurvePoint,
} from "../protection/index.ts";
import { deviceBus } from "../model/deviceBus.ts";
import type { ProtectionPath } from "./protectionPaths.ts";
import type { TccPlotInput, TccReferenceCurve } from "./tccPlotSvg.ts";

export const PATH_COLORS = ["#0f6b87", "#c05a13", "#5b3f99", "#2e7d32", "#a3267a", "#6b5d00"] as const;
const T_MIN_S = 0.01;
const T_MAX_S = 1000;

const refer = (pts: readonly CurvePoint[], k: number): CurvePoint[] => pts.map(([i, t]) => [i * k, t] as const);
const ratedCurrent_A = (s_MVA: number, u_kV: number) => (s_MVA * 1000) / (Math.sqrt(3) * u_kV);

export interface PathPlot {
  input: TccPlotInput;
  /** Devices that could not be drawn, with the protection model's reason (naming the device and field). */
  problems: string[];
}

/** True when the device has an element on residual current (51N/50N/67N, an LV ground-fault region). */
export function groundPlotWanted(project: Project, path: ProtectionPath): boolean {
  const byId = new Map<string, Element>(project.elements.map((e) => [e.id, e] as const));
  const devices = path.devices.map((id) => byId.get(id)).filter((e): e is ProtectiveDevice => !!e && isProtectiveDevice(e));
  const kv = (d: ProtectiveDevice) => {
    const b = deviceBus(d, byId);
    const bus = b ? byId.get(b) : undefined;
    return bus?.kind === "bus" ? bus.un_kV : undefined;
  };
  return devices.length > 0 && devices.filter((d) => kv(d) === kv(devices[0])).some(hasGroundElement);
}

export function hasGroundElement(d: ProtectiveDevice): boolean {
  if (d.kind === "relay") return d.functions.some((f) => f.enabled && f.quantity === "residual");
  return d.kind === "lvbreaker" && d.groundFault !== undefined;
}

/** Phase plots draw phase elements against phase current; ground plots draw earth-fault elements (or, for a
 * device without one, the phase elements that clear the fault) against residual current 3I0. */
export function pathPlot(project: Project, path: ProtectionPath, index: number, quantity: "phase" | "ground" = "phase"): PathPlot {
  const byId = new Map<string, Element>(project.elements.map((e) => [e.id, e] as const));
  const kvOf = (d: ProtectiveDevice) => {
    const b = deviceBus(d, byId);
    const bus = b ? byId.get(b) : undefined;
    return bus?.kind === "bus" ? bus.un_kV : undefined;
  };
  const all = path.devices.map((id) => byId.get(id)).filter((e): e is ProtectiveDevice => !!e && isProtectiveDevice(e));
  const reference_kV = (all.length ? kvOf(all[0]) : undefined) ?? 1;
  // residual current does not refer across a transformer by its voltage ratio (a delta winding blocks it),
  // so an earth-fault plot keeps the devices at the primary device's voltage
  const devices = quantity === "ground" ? all.filter((d) => kvOf(d) === reference_kV) : all;
  const problems: string[] = [];

  // current range: a decade below the lowest pickup to a decade above the largest fault current
  let lo = Infinity;
  let hi = 0;
  for (const d of devices) {
    try {
      const band = sampleCurve(d, { quantity, device_kV: kvOf(d), reference_kV, pointsPerDecade: 8 });
      for (const [i] of band.min) lo = Math.min(lo, i);
      for (const [i] of band.max) hi = Math.max(hi, i / 10);
    } catch {
      // reported below when the full curve is drawn
    }
  }
  const markMax = quantity === "phase" ? path.primaryMax_A : path.residualMax_A;
  const markMin = quantity === "phase" ? path.primaryMin_A : path.residualMin_A;
  if (markMax) hi = Math.max(hi, markMax);
  if (!Number.isFinite(lo)) lo = 1;
  let dLo = Math.floor(Math.log10(lo));
  let dHi = Math.ceil(Math.log10(Math.max(hi * 1.5, lo * 100)));
  if (dHi - dLo > 6) dLo = dHi - 6;
  if (dHi - dLo < 2) dHi = dLo + 2;
  const iMin_A = Math.pow(10, dLo);
  const iMax_A = Math.pow(10, dHi);

  const curves: TccPlotInput["curves"] = [];
  devices.forEach((d) => {
    const kv = kvOf(d);
    const scale = referScale(kv, reference_kV);
    try {
      const band = sampleCurve(d, {
        quantity,
        device_kV: kv,
        reference_kV,
        iMin_A: iMin_A / scale,
        iMax_A: iMax_A / scale,
        tMin_s: T_MIN_S,
        tMax_s: T_MAX_S,
        includeClearing: true,
        pointsPerDecade: 40,
      });
      if (band.nominal.length === 0) return;
      const depth = all.indexOf(d);
      const role = depth === 0 ? "primary" : depth === 1 ? "backup" : `backup ${depth}`;
      const phaseOnly = quantity === "ground" && !hasGroundElement(d) ? ", phase elements" : "";
      curves.push({ label: `${d.id} (${role}${phaseOnly}${kv !== undefined && kv !== reference_kV ? `, at ${kv} kV` : ""})`, color: PATH_COLORS[all.indexOf(d) % PATH_COLORS.length], ...band });
    } catch (err) {
      problems.push(err instanceof Error ? err.message : String(err));
    }
  });

  const references: TccReferenceCurve[] = [];
  const points: TccPlotInput["points"] = [];
  const seen = new Set<string>();
  for (const d of devices) {
    const host = byId.get(d.at.element);
    if (!host || seen.has(host.id)) continue;
    seen.add(host.id);
    try {
      if (host.kind === "transformer" && quantity === "phase") {
        const side = d.at.end === "to" ? "lv" : "hv";
        const u_kV = side === "hv" ? host.urHv_kV : host.urLv_kV;
        const ir = ratedCurrent_A(host.sr_MVA, u_kV);
        const k = referScale(u_kV, reference_kV);
        const w = transformerWithstand({ sr_kVA: host.sr_MVA * 1000, ratedCurrent_A: ir, z_pu: host.uk_pct / 100 });
        references.push({ label: `${host.id} through-fault withstand (IEEE C57.109 cat. ${w.category})`, points: refer(w.infrequent, k), style: "damage" });
        const [iIn, tIn] = inrushPoint(ir);
        points.push({ label: `${host.id} inrush`, current_A: iIn * k, time_s: tIn });
      } else if (host.kind === "line") {
        const b = deviceBus(d, byId);
        const bus = b ? byId.get(b) : undefined;
        const kv = bus?.kind === "bus" ? bus.un_kV : reference_kV;
        const kk = cableK(host.material, host.insulation, host.csa_mm2);
        references.push({ label: `${host.id} cable withstand (k ${Math.round(kk)})`, points: refer(cableWithstandCurve(kk, host.csa_mm2, host.parallel), referScale(kv, reference_kV)), style: "damage" });
        const far = byId.get(host.toBus === b ? host.fromBus : host.toBus);
        for (const m of project.elements)
          if (m.kind === "motor" && far && m.bus === far.id && quantity === "phase") {
            const irm = m.pr_kW / (m.eta * m.cosPhi) / (Math.sqrt(3) * m.ur_kV);
            const start = motorStarting({ ratedCurrent_A: irm, ilrIr: m.ilrIr, start_s: m.start_s });
            references.push({ label: `${m.id} starting`, points: refer(start.curve, referScale(m.ur_kV, reference_kV)), style: "start" });
          }
      }
    } catch (err) {
      problems.push(`${host.id}: ${err instanceof Error ? err.message : String(err)}`);
    }
  }

  const marks: TccPlotInput["marks"] = [];
  if (markMax !== null) marks.push({ label: "max", current_A: markMax });
  if (markMin !== null && markMin !== markMax) marks.push({ label: "min", current_A: markMin });

  return {
    input: {
      title: `Path ${index}${quantity === "ground" ? " (earth faults)" : ""}: ${path.devices.join(" → ")}`,
      currentLabel: quantity === "ground" ? "Residual current 3I0" : "Current",
      reference_kV,
      iMin_A,
      iMax_A,
      tMin_s: T_MIN_S,
      tMax_s: T_MAX_S,
      curves,
      references,
      marks,
      points,
    },
    problems,
  };
}
