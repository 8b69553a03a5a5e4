// Pure reducer for document edits: returns a new project, never mutates the input.
// Removing a bus disconnects (empties) the terminals that pointed at it rather than deleting
// the branch, so the user's work survives and validation names what is now unconnected.
import { isProtectiveDevice, type Element, type Project } from "../../src/model/schema.ts";
import type { DocChange } from "./changes.ts";

const BUS_FIELDS = ["bus", "fromBus", "toBus", "hvBus", "lvBus", "busA", "busB"] as const;

function setIn(target: unknown, path: (string | number)[], value: unknown): unknown {
  if (path.length === 0) return value;
  const [head, ...rest] = path;
  if (Array.isArray(target)) {
    const copy = target.slice();
    copy[head as number] = setIn(copy[head as number], rest, value);
    return copy;
  }
  const obj = (target ?? {}) as Record<string, unknown>;
  const next = { ...obj };
  if (rest.length === 0 && value === undefined) delete next[head as string];
  else next[head as string] = setIn(obj[head as string], rest, value);
  return next;
}

function removeElements(doc: Project, ids: string[]): Project {
  const gone = new Set(ids);
  // Devices located at a removed element go with it.
  for (const e of doc.elements) if (isProtectiveDevice(e) && gone.has(e.at.element)) gone.add(e.id);
  const elements: Element[] = [];
  for (const e of doc.elements) {
    if (gone.has(e.id)) continue;
    let next = e as Record<string, unknown>;
    for (const f of BUS_FIELDS) {
      if (typeof next[f] === "string" && gone.has(next[f] as string)) next = { ...next, [f]: "" };
    }
    elements.push(next as Element);
  }
  const layout = { ...doc.layout };
  for (const id of gone) delete layout[id];
  const scenarios = doc.scenarios.map((s) => ({
    ...s,
    outOfService: s.outOfService.filter((id) => !gone.has(id)),
    switchStates: Object.fromEntries(Object.entries(s.switchStates).filter(([id]) => !gone.has(id))),
  }));
  return { ...doc, elements, layout, scenarios };
}

function applyOne(doc: Project, c: DocChange): Project {
  switch (c.type) {
    case "replaceDocument":
      return c.project;
    case "addElement": {
      if (doc.elements.some((e) => e.id === c.element.id)) throw new Error(`Element id "${c.element.id}" is already in use`);
      const layout = c.place ? { ...doc.layout, [c.element.id]: { ...c.place } } : doc.layout;
      return { ...doc, elements: [...doc.elements, c.element], layout };
    }
    case "removeElements":
      return removeElements(doc, c.ids);
    case "setField": {
      const i = doc.elements.findIndex((e) => e.id === c.id);
      if (i < 0) throw new Error(`No element with id "${c.id}"`);
      if (c.path[0] === "id" || c.path[0] === "kind") throw new Error(`Element ${c.id}: the ${String(c.path[0])} field cannot be edited`);
      const elements = doc.elements.slice();
      elements[i] = setIn(elements[i], c.path, c.value) as Element;
      return { ...doc, elements };
    }
    case "moveNodes": {
      const layout = { ...doc.layout };
      for (const [id, p] of Object.entries(c.places)) layout[id] = { ...layout[id], ...p };
      return { ...doc, layout };
    }
    case "setOutOfService": {
      const scenarios = doc.scenarios.map((s) => {
        if (s.id !== c.scenarioId) return s;
        const rest = s.outOfService.filter((id) => id !== c.elementId);
        return { ...s, outOfService: c.out ? [...rest, c.elementId] : rest };
      });
      return { ...doc, scenarios };
    }
    case "addScenario":
      return { ...doc, scenarios: [...doc.scenarios, c.scenario] };
    case "updateScenario": {
      if (!doc.scenarios.some((s) => s.id === c.scenarioId)) throw new Error(`No operating mode with id "${c.scenarioId}"`);
      if (c.patch.name !== undefined && c.patch.name.trim() === "") throw new Error("An operating mode needs a name");
      const scenarios = doc.scenarios.map((s) => {
        if (s.id !== c.scenarioId) return s;
        const next = { ...s, ...c.patch };
        if (next.description === "") delete next.description;
        return next;
      });
      return { ...doc, scenarios };
    }
    case "removeScenario": {
      if (doc.scenarios.length <= 1) throw new Error("A project keeps at least one operating mode");
      return { ...doc, scenarios: doc.scenarios.filter((s) => s.id !== c.scenarioId) };
    }
    case "setSwitchState": {
      const scenarios = doc.scenarios.map((s) => {
        if (s.id !== c.scenarioId) return s;
        const { [c.switchId]: _old, ...rest } = s.switchStates;
        return { ...s, switchStates: c.closed === null ? rest : { ...rest, [c.switchId]: c.closed } };
      });
      return { ...doc, scenarios };
    }
    case "setMeta":
      return { ...doc, meta: { ...doc.meta, [c.field]: c.value } };
  }
}

export function applyChanges(doc: Project, changes: readonly DocChange[]): Project {
  return changes.reduce(applyOne, doc);
}
