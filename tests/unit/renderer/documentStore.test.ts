import { describe, it, expect, beforeEach } from "vitest";
import { useDocumentStore, undo, redo, clearHistory } from "../../../renderer/store/documentStore.ts";
import { newProject } from "../../../src/model/projectFile.ts";
import { newElement } from "../../../renderer/canvas/newElement.ts";

describe("the document store's undo history", () => {
  beforeEach(() => {
    useDocumentStore.getState().applyChanges([{ type: "replaceDocument", project: newProject("t") }], { undoable: false });
    clearHistory();
  });

  it("undoes and redoes an edit", () => {
    const { doc, applyChanges } = useDocumentStore.getState();
    applyChanges([{ type: "addElement", element: newElement("bus", doc), place: { x: 0, y: 0 } }], { undoable: true });
    expect(useDocumentStore.getState().doc.elements).toHaveLength(1);
    undo();
    expect(useDocumentStore.getState().doc.elements).toHaveLength(0);
    redo();
    expect(useDocumentStore.getState().doc.elements).toHaveLength(1);
  });

  it("does not record edits marked not undoable (opening a file)", () => {
    const { doc, applyChanges } = useDocumentStore.getState();
    applyChanges([{ type: "addElement", element: newElement("bus", doc) }], { undoable: false });
    undo();
    expect(useDocumentStore.getState().doc.elements).toHaveLength(1);
  });

  it("makes a drop after a drag, however many nodes moved, one undo step", () => {
    const { doc, applyChanges } = useDocumentStore.getState();
    applyChanges([{ type: "addElement", element: newElement("bus", doc), place: { x: 0, y: 0 } }], { undoable: true });
    applyChanges([{ type: "moveNodes", places: { B1: { x: 50, y: 70 } } }], { undoable: true });
    undo();
    expect(useDocumentStore.getState().doc.layout.B1).toEqual({ x: 0, y: 0 });
  });

  it("counts a revision for every change, undo included", () => {
    const r0 = useDocumentStore.getState().revision;
    const { doc, applyChanges } = useDocumentStore.getState();
    applyChanges([{ type: "addElement", element: newElement("bus", doc) }], { undoable: true });
    undo();
    expect(useDocumentStore.getState().revision).toBe(r0 + 2);
  });
});
