// Every setting the device models read, flattened in a fixed order: two records with equal keys time out
// identically. Cheaper than serialising the whole record, which also carries names and unknown fields.
import type { ProtectiveDevice } from "./types.ts";

export function settingsKey(d: ProtectiveDevice): unknown[] {
  const k: unknown[] = [d.kind, d.id, d.name];
  if (d.kind === "relay") {
    const t = d.tolerance;
    k.push(d.ctPrimary_A, d.ctSecondary_A, d.breakerTime_s, t?.pickup_pct, t?.time_pct, t?.time_min_s, d.functions?.length);
    for (const f of d.functions ?? []) {
      k.push(f.id, f.ansi, f.enabled, f.quantity, f.curve, f.pickup_A, f.multiplier, f.delay_s, f.tMin_s, f.tMax_s, f.reset, f.direction, f.rca_deg);
      k.push(f.restraint?.vFull_pu, f.restraint?.kMin);
    }
  } else if (d.kind === "fuse") {
    const c = d.curve;
    k.push(d.rating_A, c?.kind);
    if (c?.kind === "parametric") k.push(c.family);
    else if (c?.kind === "points") {
      for (const list of [c.melt, c.clear]) {
        k.push(Array.isArray(list) ? list.length : list);
        if (Array.isArray(list)) for (const p of list) k.push(...(Array.isArray(p) ? [p.length, p[0], p[1]] : [p]));
      }
    }
  } else if (d.kind === "lvbreaker") {
    const { longTime: lt, shortTime: st, instantaneous: ii, groundFault: gf, tolerance: t } = d;
    k.push(d.in_A, d.clearing_s, t?.pickup_pct, t?.time_pct, t?.time_min_s, lt?.ir_x, lt?.tr_s, lt?.ref_x);
    k.push(st !== undefined, st?.isd_x, st?.tsd_s, st?.i2t, ii !== undefined, ii?.ii_x, gf !== undefined, gf?.ig_A, gf?.tg_s, gf?.i2t);
  }
  return k;
}

export function sameKey(a: readonly unknown[], b: readonly unknown[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (!Object.is(a[i], b[i])) return false;
  return true;
}
