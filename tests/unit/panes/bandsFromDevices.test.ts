import { describe, expect, it } from "vitest";
import { evaluate } from "mathjs";
import { fuseSchema, lvBreakerSchema, relaySchema } from "../../../src/model/schema.ts";
import { bandsFromDevices } from "../../../renderer/panes/tcc/bandsFromDevices.ts";
import { curveTimeAt } from "../../../renderer/panes/tcc/curveTimeAt.ts";

const relay = relaySchema.parse({
  kind: "relay",
  id: "R1",
  name: "Test feeder",
  at: { element: "L1", end: "from" },
  ctPrimary_A: 200,
  functions: [{ id: "f51", ansi: "51", quantity: "phase", curve: "iec-standard-inverse", pickup_A: 100, multiplier: 0.1 }],
});

describe("relay band on the time-current pane", () => {
  const [band] = bandsFromDevices([{ device: relay, device_kV: 11 }], { reference_kV: 0.4 });

  it("is referred to the plot voltage and reads the IEC curve plus breaker time", () => {
    // 2 x pickup at 11 kV is 200 A, i.e. 200 * 11 / 0.4 = 5500 A at 0.4 kV (current ratio of an ideal transformer)
    const iRef_A = evaluate("2 * 100 * 11 / 0.4") as number;
    // IEC 60255-151 Table 1, SI at 2x, TMS 0.1: 1.003 s; plus the schema's default breaker time 0.06 s
    expect(curveTimeAt(band.nominal, iRef_A)).toBeCloseTo(1.003 + 0.06, 2);
  });

  it("has its fast edge below and its slow edge above the nominal curve", () => {
    // tolerance band: min edge at lower pickup/time tolerance, max edge at upper (IEC 60255-151 accuracy classes, common practice)
    const i = 5500;
    const tn = curveTimeAt(band.nominal, i)!;
    expect(curveTimeAt(band.min, i)!).toBeLessThan(tn);
    expect(curveTimeAt(band.max, i)!).toBeGreaterThan(tn);
  });

  it("edits the inverse-time function's pickup and multiplier in device amperes", () => {
    expect(band).toMatchObject({ deviceId: "R1", functionId: "f51", pickup_A: 100, multiplier: 0.1, draggable: { pickup: true, multiplier: true } });
  });

  it("offers no multiplier drag on a definite-time-only relay", () => {
    const dt = relaySchema.parse({ ...relay, functions: [{ id: "f50", ansi: "50", quantity: "phase", curve: "definite-time", pickup_A: 800, delay_s: 0.1 }] });
    const [b] = bandsFromDevices([{ device: dt, device_kV: 11 }], { reference_kV: 11 });
    expect(b.draggable).toEqual({ pickup: true, multiplier: false });
    expect(b.multiplier).toBeUndefined();
  });
});

describe("fuse and LV breaker bands", () => {
  const fuse = fuseSchema.parse({ kind: "fuse", id: "F1", name: "Pump fuse", at: { element: "M1", end: "terminal" }, rating_A: 160 });
  const breaker = lvBreakerSchema.parse({ kind: "lvbreaker", id: "Q1", at: { element: "L2", end: "from" }, in_A: 400, longTime: { ir_x: 0.8, tr_s: 6 } });
  const [fb, bb] = bandsFromDevices(
    [
      { device: fuse, device_kV: 0.4 },
      { device: breaker, device_kV: 0.4 },
    ],
    { reference_kV: 0.4 },
  );

  it("drags a fuse's rating sideways only", () => {
    expect(fb).toMatchObject({ functionId: "fuse", pickup_A: 160, draggable: { pickup: true } });
    expect(fb.draggable?.multiplier).toBeFalsy();
  });

  it("gives an LV breaker the long-time pickup Ir = ir_x x In", () => {
    // IEC 60947-2: Ir is set as a multiple of the rated current In; 0.8 x 400 A = 320 A
    expect(bb.pickup_A).toBeCloseTo(320, 9);
    expect(bb.functionId).toBe("long-time");
    expect(bb.deviceName).toBe("Q1");
  });
});
