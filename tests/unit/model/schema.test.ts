import { describe, it, expect } from "vitest";
import { busSchema } from "../../../src/model/schema";

describe("bus record", () => {
  it("rejects a non-positive nominal voltage", () => {
    expect(busSchema.safeParse({ kind: "bus", id: "B1", un_kV: 0 }).success).toBe(false);
    expect(busSchema.safeParse({ kind: "bus", id: "B1", un_kV: 0.4 }).success).toBe(true);
  });
});
