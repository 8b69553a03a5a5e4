// Settings validation for protective devices: every message names the element (id and name) and the field.
// Errors are settings the models cannot compute with; warnings are settings outside usual practice.
import type { RelayFunction, Tolerance } from "../model/schema.ts";
import type { Fuse, LvBreaker, Message, ProtectiveDevice, Relay, Severity } from "./types.ts";
import { deviceLabel } from "./deviceLabel.ts";
import { curveFamily } from "./curveConstants.ts";
import { logLogInterpolate } from "./logLogInterpolate.ts";

/** Usual setting ranges. IEC TMS 0.01-1.5 and IEEE TD 0.1-15 // common practice (numerical relay setting ranges). */
export const TMS_RANGE = { min: 0.01, max: 1.5 } as const;
export const TD_RANGE = { min: 0.1, max: 15 } as const;

const EXPECTED_QUANTITY: Record<RelayFunction["ansi"], RelayFunction["quantity"]> = {
  "51": "phase",
  "50": "phase",
  "67": "phase",
  "51V": "phase",
  "51N": "residual",
  "50N": "residual",
  "67N": "residual",
  "46": "negative",
  "51Q": "negative",
};

type Device = Pick<ProtectiveDevice, "kind" | "id" | "name">;

class Collector {
  readonly out: Message[] = [];
  constructor(private readonly device: Device) {}
  add(severity: Severity, field: string, problem: string, got?: unknown): void {
    const tail = got === undefined ? "" : ` (got ${fmt(got)})`;
    this.out.push({
      severity,
      elementId: this.device.id,
      elementName: this.device.name ?? "",
      field,
      text: `${deviceLabel(this.device)}: ${field} ${problem}${tail}`,
    });
  }
  /** Error unless value is a finite number meeting the test. Returns whether it is usable. */
  num(field: string, value: unknown, test: (v: number) => boolean, rule: string): value is number {
    if (typeof value !== "number" || !Number.isFinite(value)) {
      this.add("error", field, "must be a finite number", value === undefined ? "nothing" : value);
      return false;
    }
    if (!test(value)) {
      this.add("error", field, rule, value);
      return false;
    }
    return true;
  }
}

function fmt(v: unknown): string {
  if (typeof v === "number") return String(Number(v.toPrecision(6)));
  if (typeof v === "string") return v === "nothing" ? v : JSON.stringify(v);
  return JSON.stringify(v) ?? String(v);
}

function checkTolerance(c: Collector, tol: Tolerance | undefined): void {
  if (!tol) return c.add("error", "tolerance", "is missing");
  c.num("tolerance.pickup_pct", tol.pickup_pct, (v) => v >= 0 && v < 100, "must be >= 0 and < 100");
  c.num("tolerance.time_pct", tol.time_pct, (v) => v >= 0 && v < 100, "must be >= 0 and < 100");
  c.num("tolerance.time_min_s", tol.time_min_s, (v) => v >= 0, "must be >= 0");
}

function checkFunction(c: Collector, fn: RelayFunction, k: number): void {
  const f = `functions[${k}]`;
  const who = `(function ${fn.id})`;
  c.num(`${f}.pickup_A`, fn.pickup_A, (v) => v > 0, `${who} must be > 0`);
  const family = curveFamily(fn.curve);
  if (family === "definite") {
    c.num(`${f}.delay_s`, fn.delay_s, (v) => v >= 0, `${who} must be >= 0`);
  } else if (c.num(`${f}.multiplier`, fn.multiplier, (v) => v > 0, `${who} must be > 0`)) {
    const r = family === "iec" ? TMS_RANGE : TD_RANGE;
    const word = family === "iec" ? "TMS" : "time dial";
    if (fn.multiplier < r.min || fn.multiplier > r.max) {
      c.add("warning", `${f}.multiplier`, `${who} ${word} is outside the usual ${r.min}-${r.max}`, fn.multiplier);
    }
  }
  const tMinOk = c.num(`${f}.tMin_s`, fn.tMin_s, (v) => v >= 0, `${who} must be >= 0`);
  if (fn.tMax_s !== undefined && c.num(`${f}.tMax_s`, fn.tMax_s, (v) => v > 0, `${who} must be > 0`) && tMinOk && fn.tMin_s > fn.tMax_s) {
    c.add("error", `${f}.tMin_s`, `${who} must not exceed tMax_s ${fn.tMax_s} s`, fn.tMin_s);
  }
  const expected = EXPECTED_QUANTITY[fn.ansi];
  if (expected === undefined) c.add("error", `${f}.ansi`, `${who} is not a supported device number`, fn.ansi);
  else if (fn.quantity !== expected) c.add("warning", `${f}.quantity`, `${who} is unusual for device ${fn.ansi} (expected ${expected})`, fn.quantity);
  if ((fn.ansi === "67" || fn.ansi === "67N") && fn.direction === "non-directional") {
    c.add("warning", `${f}.direction`, `${who} device ${fn.ansi} is set non-directional`);
  }
  if (fn.reset === "ieee" && family !== "ieee") {
    c.add("warning", `${f}.reset`, `${who} IEEE reset applies to IEEE curves only; this curve resets instantaneously`);
  }
  if (fn.restraint) {
    c.num(`${f}.restraint.kMin`, fn.restraint.kMin, (v) => v > 0 && v <= 1, `${who} must be > 0 and <= 1`);
    c.num(`${f}.restraint.vFull_pu`, fn.restraint.vFull_pu, (v) => v > 0, `${who} must be > 0`);
  }
  if (fn.direction !== "non-directional") c.num(`${f}.rca_deg`, fn.rca_deg, (v) => v >= -180 && v <= 180, `${who} must be within -180..180`);
}

function checkRelay(c: Collector, r: Relay): void {
  c.num("ctPrimary_A", r.ctPrimary_A, (v) => v > 0, "must be > 0");
  if (r.ctSecondary_A !== 1 && r.ctSecondary_A !== 5) c.add("error", "ctSecondary_A", "must be 1 or 5", r.ctSecondary_A);
  c.num("breakerTime_s", r.breakerTime_s, (v) => v >= 0, "must be >= 0");
  checkTolerance(c, r.tolerance);
  if (!Array.isArray(r.functions)) return c.add("error", "functions", "must be a list");
  const seen = new Set<string>();
  r.functions.forEach((fn, k) => {
    if (seen.has(fn.id)) c.add("error", `functions[${k}].id`, "repeats another function's id", fn.id);
    seen.add(fn.id);
    checkFunction(c, fn, k);
  });
  if (!r.functions.some((f) => f.enabled)) c.add("warning", "functions", "has no enabled function: the relay never operates");
}

function checkPoints(c: Collector, field: string, pts: unknown): pts is [number, number][] {
  if (!Array.isArray(pts) || pts.length < 2) {
    c.add("error", field, "needs at least 2 [A, s] points", Array.isArray(pts) ? `${pts.length} points` : "nothing");
    return false;
  }
  let ok = true;
  pts.forEach((p, k) => {
    if (!Array.isArray(p) || p.length !== 2 || !p.every((v) => typeof v === "number" && Number.isFinite(v) && v > 0)) {
      c.add("error", `${field}[${k}]`, "must be a pair [A, s] of positive numbers", p);
      ok = false;
    }
  });
  if (!ok) return false;
  for (let k = 1; k < pts.length; k++) {
    const [i0, t0] = pts[k - 1] as [number, number];
    const [i1, t1] = pts[k] as [number, number];
    if (!(i1 > i0)) {
      c.add("error", `${field}[${k}]`, `current must increase from point to point (${i0} A then ${i1} A)`);
      ok = false;
    } else if (!(t1 < t0)) {
      c.add("error", `${field}[${k}]`, `time must strictly decrease as current increases (${t0} s at ${i0} A, then ${t1} s at ${i1} A)`);
      ok = false;
    }
  }
  return ok;
}

function checkFuse(c: Collector, f: Fuse): void {
  c.num("rating_A", f.rating_A, (v) => v > 0, "must be > 0");
  const curve = f.curve;
  if (!curve) return c.add("error", "curve", "is missing");
  if (curve.kind === "parametric") {
    if (!["general-purpose", "fast", "time-delay"].includes(curve.family)) c.add("error", "curve.family", "is not a known family", curve.family);
    return;
  }
  const meltOk = checkPoints(c, "curve.melt", curve.melt);
  const clearOk = checkPoints(c, "curve.clear", curve.clear);
  if (meltOk && clearOk) {
    if (curve.clear[0][0] < curve.melt[0][0]) {
      c.add("warning", "curve.clear", `starts below the melting curve's lowest current (${curve.clear[0][0]} A < ${curve.melt[0][0]} A)`);
    }
    const faster = curve.melt.find(([i, t]) => logLogInterpolate(curve.clear, i) < t);
    if (faster) c.add("warning", "curve.clear", `is faster than the melting curve at ${faster[0]} A: total clearing cannot precede melting`);
  }
}

function checkLvBreaker(c: Collector, b: LvBreaker): void {
  const inOk = c.num("in_A", b.in_A, (v) => v > 0, "must be > 0");
  c.num("clearing_s", b.clearing_s, (v) => v >= 0, "must be >= 0");
  checkTolerance(c, b.tolerance);
  const lt = b.longTime;
  if (!lt) return c.add("error", "longTime", "is missing");
  const irOk = c.num("longTime.ir_x", lt.ir_x, (v) => v >= 0.4 && v <= 1, "must be within 0.4..1");
  c.num("longTime.tr_s", lt.tr_s, (v) => v > 0, "must be > 0");
  c.num("longTime.ref_x", lt.ref_x, (v) => v > 1.3, "must be above 1.3 (the long-time band is referred to an overcurrent)");
  const st = b.shortTime;
  if (st) {
    c.num("shortTime.isd_x", st.isd_x, (v) => v > 1, "must be > 1: Isd below Ir would trip on load current");
    c.num("shortTime.tsd_s", st.tsd_s, (v) => v >= 0, "must be >= 0");
  }
  const inst = b.instantaneous;
  if (inst && c.num("instantaneous.ii_x", inst.ii_x, (v) => v > 0, "must be > 0") && inOk && irOk) {
    const ir = lt.ir_x * b.in_A;
    if (inst.ii_x * b.in_A <= ir) c.add("error", "instantaneous.ii_x", `gives Ii ${inst.ii_x * b.in_A} A, not above Ir ${ir} A`);
    else if (st && Number.isFinite(st.isd_x) && inst.ii_x * b.in_A <= st.isd_x * ir) {
      c.add("warning", "instantaneous.ii_x", `gives Ii at or below Isd (${inst.ii_x * b.in_A} A <= ${st.isd_x * ir} A): the short-time delay never acts`);
    }
  }
  const gf = b.groundFault;
  if (gf) {
    c.num("groundFault.ig_A", gf.ig_A, (v) => v > 0, "must be > 0");
    c.num("groundFault.tg_s", gf.tg_s, (v) => v >= 0, "must be >= 0");
  }
}

/** All settings problems of a device, errors first. */
export function checkDeviceSettings(device: ProtectiveDevice): Message[] {
  const c = new Collector(device);
  if (typeof device.id !== "string" || device.id === "") c.add("error", "id", "must be a non-empty text", device.id);
  switch (device.kind) {
    case "relay":
      checkRelay(c, device);
      break;
    case "fuse":
      checkFuse(c, device);
      break;
    case "lvbreaker":
      checkLvBreaker(c, device);
      break;
    default:
      c.add("error", "kind", "is not a protective device", (device as { kind: unknown }).kind);
  }
  return [...c.out.filter((m) => m.severity === "error"), ...c.out.filter((m) => m.severity === "warning")];
}
