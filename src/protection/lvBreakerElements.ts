// Time elements of an LV trip unit: long-time, short-time, instantaneous, ground fault.
//
// Long time: Ir = ir_x * In; t = tr_s * ref_x^2 / (I / Ir)^2 (constant I^2 t through tr_s at ref_x * Ir).
// It picks up at LT_PICKUP_X * Ir nominal; with the pickup tolerance the band stays inside the conventional
// zone: no trip at or below 1.05 Ir, trip guaranteed at 1.30 Ir (IEC 60947-2 conventional non-tripping and
// tripping currents, // from memory).
// Short time: Isd = isd_x * Ir, delay tsd_s; with i2t a constant-I^2 t ramp below 10 x Ir meeting tsd_s there.
// Instantaneous: Ii = ii_x * In, no intentional delay.
// Ground fault on 3I0: ig_A, tg_s; with i2t a constant-I^2 t ramp below GF_RAMP_X * ig_A (project convention).
import type { Band, LvBreaker } from "./types.ts";
import type { TimeElement } from "./timeElement.ts";
import { bandPickup, bandTime } from "./tolerance.ts";

export const LT_PICKUP_X = 1.15;
export const LT_NO_TRIP_X = 1.05;
export const LT_TRIP_X = 1.3;
export const ST_RAMP_X = 10;
export const GF_RAMP_X = 10;

export function lvBreakerElements(b: LvBreaker): TimeElement[] {
  const tol = b.tolerance;
  const ir = b.longTime.ir_x * b.in_A;
  const irBand = (band: Band) => bandPickup(ir, tol, band);
  const out: TimeElement[] = [];

  const ltPickup = (band: Band) => Math.min(LT_TRIP_X * ir, Math.max(LT_NO_TRIP_X * ir, LT_PICKUP_X * irBand(band)));
  out.push({
    id: "long-time",
    title: "long-time",
    quantity: "phase",
    pickup_A: ltPickup,
    time_s: (i, band) => {
      if (!(i > ltPickup(band))) return Infinity;
      const x = i / irBand(band);
      return bandTime((b.longTime.tr_s * b.longTime.ref_x ** 2) / (x * x), tol, band);
    },
    reset_s: () => 0,
    breakpoints_A: (band) => [ltPickup(band)],
    added_s: b.clearing_s,
  });

  const st = b.shortTime;
  if (st) {
    const isd = (band: Band) => bandPickup(st.isd_x * ir, tol, band);
    out.push({
      id: "short-time",
      title: st.i2t ? "short-time (I2t)" : "short-time",
      quantity: "phase",
      pickup_A: isd,
      time_s: (i, band) => {
        if (!(i > isd(band))) return Infinity;
        const ramp = ST_RAMP_X * irBand(band);
        const t = st.i2t && i < ramp ? st.tsd_s * (ramp / i) ** 2 : st.tsd_s;
        return bandTime(t, tol, band);
      },
      reset_s: () => 0,
      breakpoints_A: (band) => (st.i2t ? [isd(band), ST_RAMP_X * irBand(band)] : [isd(band)]),
      added_s: b.clearing_s,
    });
  }

  const inst = b.instantaneous;
  if (inst) {
    const ii = (band: Band) => bandPickup(inst.ii_x * b.in_A, tol, band);
    out.push({
      id: "instantaneous",
      title: "instantaneous",
      quantity: "phase",
      pickup_A: ii,
      time_s: (i, band) => (i > ii(band) ? bandTime(0, tol, band) : Infinity),
      reset_s: () => 0,
      breakpoints_A: (band) => [ii(band)],
      added_s: b.clearing_s,
    });
  }

  const gf = b.groundFault;
  if (gf) {
    const ig = (band: Band) => bandPickup(gf.ig_A, tol, band);
    out.push({
      id: "ground-fault",
      title: gf.i2t ? "ground-fault (I2t)" : "ground-fault",
      quantity: "residual",
      pickup_A: ig,
      time_s: (i, band) => {
        if (!(i > ig(band))) return Infinity;
        const ramp = GF_RAMP_X * ig(band);
        const t = gf.i2t && i < ramp ? gf.tg_s * (ramp / i) ** 2 : gf.tg_s;
        return bandTime(t, tol, band);
      },
      reset_s: () => 0,
      breakpoints_A: (band) => (gf.i2t ? [ig(band), GF_RAMP_X * ig(band)] : [ig(band)]),
      added_s: b.clearing_s,
    });
  }
  return out;
}
