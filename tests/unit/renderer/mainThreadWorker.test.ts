import { describe, it, expect } from "vitest";
import { mainThreadPort } from "../../../renderer/worker/studioWorker.ts";
import { engineClient } from "../../../renderer/worker/engineClient.ts";
import { studyClient } from "../../../renderer/worker/studyClient.ts";
import { newProject } from "../../../src/model/projectFile.ts";
import { newElement } from "../../../renderer/canvas/newElement.ts";
import type { Element } from "../../../src/model/schema.ts";

function gridOnly() {
  const p = newProject("t");
  p.elements.push({ ...newElement("bus", p), un_kV: 20 } as Element);
  p.elements.push({ ...newElement("grid", p), bus: "B1", skMax_MVA: 400 } as Element);
  return p;
}

describe("the calculation client on the main thread (the fallback when there is no worker)", () => {
  it("answers a fault request with the feeder's short-circuit current", async () => {
    const client = engineClient(mainThreadPort());
    const { result } = client.call({ kind: "fault", project: gridOnly(), limit: "max", location: { kind: "bus", bus: "B1" }, faultType: "3ph" });
    const r = await result;
    expect(r.ok && r.kind === "fault").toBe(true);
    // IEC 60909-0:2016 clause 6.2: ZQ = c UnQ^2 / S"kQ, so at the feeder's own bus I"k = c Un / (sqrt(3) ZQ) = S"kQ / (sqrt(3) UnQ)
    if (r.ok && r.kind === "fault") expect(r.result.ikss_kA).toBeCloseTo(400 / (Math.sqrt(3) * 20), 6);
  });

  it("lets a newer request on the same channel supersede an older one", async () => {
    const client = engineClient(mainThreadPort());
    const req = { kind: "fault" as const, channel: "overlay", project: gridOnly(), limit: "max" as const, location: { kind: "bus" as const, bus: "B1" }, faultType: "3ph" as const };
    const first = client.call(req);
    const second = client.call(req);
    const [a, b] = await Promise.all([first.result, second.result]);
    expect(a.ok === false && a.cancelled).toBe(true);
    expect(b.ok).toBe(true);
  });

  it("cancels a running full study", async () => {
    const client = studyClient(mainThreadPort());
    const { requestId, result } = client.call({ kind: "full", project: gridOnly() });
    client.cancel(requestId);
    const r = await result;
    expect(r.kind).toBe("cancelled");
  });

  it("answers a cancelled study at once and drops a result the worker sends after it", async () => {
    const posted: string[] = [];
    let reply: ((r: unknown) => void) | null = null;
    const port = {
      post: (call: { service: string }) => void posted.push(call.service),
      listen: (h: (r: unknown) => void) => void (reply = h),
      onFailure: () => {},
      terminate: () => {},
    };
    const client = studyClient(port as never);
    const { requestId, result } = client.call({ kind: "full", project: gridOnly() });
    client.cancel(requestId);
    // the worker had already finished: its answer arrives after the cancel
    reply!({ service: "study", response: { kind: "full", requestId, ok: true, result: {} } });
    expect((await result).kind).toBe("cancelled");
    expect(posted).toEqual(["study", "study-cancel"]);
  });
});
