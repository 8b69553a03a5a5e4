// The LV overload check (IEC 60364-4-43, 433.1) for a fuse or LV breaker at a cable end, as warning
// lines for Properties. The design current is not in the model yet, so IB <= In is not judged here.
import type { Element, Project } from "../../src/model/schema.ts";
import { checkLvOverload, deviceOverloadCurrents } from "../../src/protection/lvOverload.ts";

export function overloadWarnings(doc: Project, device: Element): string[] {
  if (device.kind !== "lvbreaker" && device.kind !== "fuse") return [];
  const line = doc.elements.find((e) => e.id === device.at.element);
  if (line?.kind !== "line" || !(line.ampacity_A > 0)) return [];
  const currents = deviceOverloadCurrents(device);
  if (!(currents.rated_A > 0)) return [];
  const finding = checkLvOverload({ ...currents, ampacity_A: line.ampacity_A * line.parallel });
  const cable = line.name ? `${line.name} (${line.id})` : line.id;
  return finding.texts.map((t) => `Overload protection of ${cable} (IEC 60364-4-43, 433.1): ${t}.`);
}
