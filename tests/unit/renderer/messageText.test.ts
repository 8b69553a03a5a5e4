import { describe, it, expect } from "vitest";
import { messageText } from "../../../renderer/inspector/messageText.ts";
import { validateProject } from "../../../src/model/validate.ts";
import { newProject } from "../../../src/model/projectFile.ts";
import type { Project } from "../../../src/model/schema.ts";

describe("model messages in the studio's words", () => {
  it("names the element and the field by its label, with its key after it", () => {
    const p = newProject("m") as Project;
    (p.elements as unknown[]).push(
      { kind: "bus", id: "B1", un_kV: 0.4 },
      { kind: "bus", id: "B2", un_kV: 0.4 },
      { kind: "line", id: "C12", name: "Dock feeder", fromBus: "B1", toBus: "B2", length_km: -3, r1_ohmPerKm: 0.2, x1_ohmPerKm: 0.08, r0_ohmPerKm: 0.8, x0_ohmPerKm: 0.3, csa_mm2: 95, ampacity_A: 250 },
    );
    const m = validateProject(p).find((x) => x.field === "length_km");
    expect(m?.text).toContain("length_km"); // the model keeps the key (files, command line)
    expect(messageText(m!, p)).toBe('Cable C12 "Dock feeder": Route length (length_km) must be > 0 (got -3)');
  });

  it("leaves a message without a field, or on an unknown element, as it is", () => {
    const p = newProject("m");
    expect(messageText({ severity: "error", text: "Project: no buses" }, p)).toBe("Project: no buses");
    expect(messageText({ severity: "error", text: "X: a_b must", elementId: "nope", field: "a_b" }, p)).toBe("X: a_b must");
  });
});
