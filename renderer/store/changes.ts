// The typed union of every edit the studio can make to the project document.
// All edits go through documentStore.applyChanges, which calls the pure applyChanges below.
import type { Element, Project, Scenario } from "../../src/model/schema.ts";

export interface NodePlace {
  x: number;
  y: number;
  w?: number;
}

export type DocChange =
  | { type: "addElement"; element: Element; place?: NodePlace }
  | { type: "removeElements"; ids: string[] }
  | { type: "setField"; id: string; path: (string | number)[]; value: unknown }
  | { type: "moveNodes"; places: Record<string, NodePlace> }
  | { type: "setOutOfService"; scenarioId: string; elementId: string; out: boolean }
  | { type: "addScenario"; scenario: Scenario }
  | { type: "updateScenario"; scenarioId: string; patch: { name?: string; description?: string } }
  | { type: "removeScenario"; scenarioId: string }
  /** closed: null goes back to the switch's own state. */
  | { type: "setSwitchState"; scenarioId: string; switchId: string; closed: boolean | null }
  | { type: "setMeta"; field: "name" | "description" | "author"; value: string }
  | { type: "replaceDocument"; project: Project };
