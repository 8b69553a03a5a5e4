// Cross-check between two independent pieces of the model: networks from the synthetic generator
// must pass validation with no errors, and survive a save-load round trip unchanged.
import { describe, it, expect } from "vitest";
import { generateMeshedNetwork, generateRadialNetwork } from "../../../src/model/generateNetwork.ts";
import { validateProject } from "../../../src/model/validate.ts";
import { loadProject, serializeProject } from "../../../src/model/projectFile.ts";

describe("generated networks", () => {
  it.each([
    ["radial", generateRadialNetwork({ buses: 120, devices: 60, seed: 11 })],
    ["meshed", generateMeshedNetwork({ buses: 120, devices: 60, seed: 12 })],
  ])("a %s network validates without errors and round-trips", (_kind, project) => {
    expect(validateProject(project).filter((m) => m.severity === "error")).toEqual([]);
    const r = loadProject(serializeProject(project));
    expect(r.ok && r.project).toEqual(project);
  });
});
