import { describe, it, expect, beforeEach } from "vitest";
import { useDocumentStore, clearHistory } from "../../../renderer/store/documentStore.ts";
import { useSessionStore } from "../../../renderer/store/sessionStore.ts";
import { copySelection, paste, deleteSelection } from "../../../renderer/canvas/editCommands.ts";
import { newProject } from "../../../src/model/projectFile.ts";
import { newElement } from "../../../renderer/canvas/newElement.ts";
import type { Element } from "../../../src/model/schema.ts";

describe("copy and paste on the one-line", () => {
  beforeEach(() => {
    const p = newProject("t");
    p.elements.push(newElement("bus", p));
    p.elements.push(newElement("bus", p));
    p.elements.push({ ...newElement("line", p), fromBus: "B1", toBus: "B2" } as Element);
    p.elements.push(newElement("fuse", p, { element: "C1", end: "from" }));
    p.layout = { B1: { x: 0, y: 0 }, B2: { x: 0, y: 200 }, C1: { x: 0, y: 100 } };
    useDocumentStore.getState().applyChanges([{ type: "replaceDocument", project: p }], { undoable: false });
    clearHistory();
  });

  it("pastes fresh ids; ties to copied buses follow the copies, ties to other buses stay", () => {
    useSessionStore.getState().set({ selection: ["C1", "B2"] });
    copySelection();
    paste(40);
    const doc = useDocumentStore.getState().doc;
    const line = doc.elements.find((e) => e.id === "C2");
    expect(line).toMatchObject({ fromBus: "B1", toBus: "B3" });
    expect(doc.elements.find((e) => e.id === "F2")).toMatchObject({ at: { element: "C2", end: "from" } });
    expect(doc.layout.C2).toEqual({ x: 40, y: 140 });
    expect(useSessionStore.getState().selection.sort()).toEqual(["B3", "C2"]);
  });

  it("deletes the selection in one step and clears it", () => {
    useSessionStore.getState().set({ selection: ["C1"] });
    deleteSelection();
    expect(useDocumentStore.getState().doc.elements.map((e) => e.id)).toEqual(["B1", "B2"]);
    expect(useSessionStore.getState().selection).toEqual([]);
  });
});
