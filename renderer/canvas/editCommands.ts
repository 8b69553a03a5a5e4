// Editing commands shared by the toolbar, the keyboard and the canvas. Each turns the session's
// selection into document changes and sends them through the one write path.
import { ownValue } from "../../src/model/ownValue.ts";
import { isProtectiveDevice, type DeviceLocation, type Element, type ElementKind } from "../../src/model/schema.ts";
import { useDocumentStore, undo } from "../store/documentStore.ts";
import { removalNotice, removalSummary } from "../store/removalSummary.ts";
import { useSessionStore } from "../store/sessionStore.ts";
import type { DocChange, NodePlace } from "../store/changes.ts";
import { newElement, nextId } from "./newElement.ts";
import { withRatedDefaults } from "../../src/protection/defaultSettings.ts";
import { isBranchLike, nodeSize, terminalFields } from "./toFlow.ts";

const PROTECTIVE: ElementKind[] = ["relay", "fuse", "lvbreaker"];

export function isProtectiveKind(kind: ElementKind): boolean {
  return PROTECTIVE.includes(kind);
}

/** Adds an element; devices go at the given location; `tieTo` connects the new element's first
 * terminal to that bus (a part dropped on a bus). Returns the new id (null when refused). */
export function addElement(kind: ElementKind, place: NodePlace, at: DeviceLocation | null = null, tieTo: string | null = null): string | null {
  const { doc, applyChanges } = useDocumentStore.getState();
  const session = useSessionStore.getState();
  if (isProtectiveKind(kind) && !at) {
    session.notify("info", "Place a protective device on a branch end or on a source, motor or load: drop it there, or select that element first.");
    return null;
  }
  // a protective device starts from the protected element's rating where it has one
  const { device: created, basis } = withRatedDefaults(newElement(kind, doc, at), doc);
  const terminal = tieTo ? terminalFields(created).a : undefined;
  const element = terminal ? ({ ...created, [terminal]: tieTo } as Element) : created;
  applyChanges([{ type: "addElement", element, place: at ? undefined : place }], { undoable: true });
  session.set({ selection: [element.id] });
  if (basis) session.notify("info", `${element.name}: starting settings from the rating: ${basis}. Check them against the study.`, undefined, { topic: "defaults" });
  return element.id;
}

/** The drawn size of a new part of this kind (upright). */
export function newPartSize(kind: ElementKind): { w: number; h: number } {
  return nodeSize({ kind } as Element);
}

/** Where a device dropped on or added to `host` sits: the top end for a branch unless `lower`. */
export function deviceLocationOn(host: Element, lower: boolean): DeviceLocation | null {
  if (host.kind === "bus" || isProtectiveDevice(host)) return null;
  if (isBranchLike(host)) return { element: host.id, end: lower ? "to" : "from" };
  return { element: host.id, end: "terminal" };
}

/** One undo step; the notice says what went with the selection and what is left not connected. */
export function deleteSelection(): void {
  const { selection, set, notify } = useSessionStore.getState();
  if (selection.length === 0) return;
  const { doc, applyChanges } = useDocumentStore.getState();
  const summary = removalSummary(doc, selection);
  applyChanges([{ type: "removeElements", ids: selection }], { undoable: true });
  set({ selection: [] });
  if (summary.devicesToo.length > 0 || summary.leftUnconnected.length > 0) {
    const { text, details } = removalNotice(summary);
    const revision = useDocumentStore.getState().revision;
    // the notice's Undo only undoes this deletion, not a later edit
    notify("info", text, details, { topic: "deletion", action: { label: "Undo", run: () => useDocumentStore.getState().revision === revision && undo() } });
  }
}

export function copySelection(): void {
  const { doc } = useDocumentStore.getState();
  const session = useSessionStore.getState();
  const chosen = new Set(session.selection);
  // devices travel with the element they look into
  for (const e of doc.elements) if (isProtectiveDevice(e) && chosen.has(e.at.element)) chosen.add(e.id);
  const elements = doc.elements.filter((e) => chosen.has(e.id));
  if (elements.length === 0) return;
  const places: Record<string, NodePlace> = {};
  for (const e of elements) {
    const place = ownValue(doc.layout, e.id);
    if (place) places[e.id] = { ...place } as NodePlace;
  }
  session.set({ clipboard: { elements, places } });
}

/** Pastes with fresh ids; ties to copied buses follow the copies, ties to other buses are kept. */
export function paste(offset = 40): void {
  const session = useSessionStore.getState();
  const clip = session.clipboard;
  if (!clip) return;
  const { doc, applyChanges } = useDocumentStore.getState();
  const taken = new Set(doc.elements.map((e) => e.id));
  const idMap = new Map<string, string>();
  for (const e of clip.elements) {
    const id = nextId(e.kind, taken);
    taken.add(id);
    idMap.set(e.id, id);
  }
  const changes: DocChange[] = [];
  for (const e of clip.elements) {
    const copy = structuredClone(e) as Record<string, unknown>;
    copy.id = idMap.get(e.id);
    for (const field of Object.values(terminalFields(e))) {
      const bus = copy[field];
      if (typeof bus === "string" && idMap.has(bus)) copy[field] = idMap.get(bus);
    }
    if (isProtectiveDevice(e)) {
      const host = idMap.get(e.at.element);
      if (!host) continue;
      copy.at = { ...e.at, element: host };
    }
    const p = clip.places[e.id];
    changes.push({ type: "addElement", element: copy as Element, place: p ? { ...p, x: p.x + offset, y: p.y + offset } : undefined });
  }
  applyChanges(changes, { undoable: true });
  session.set({ selection: clip.elements.filter((e) => !isProtectiveDevice(e)).map((e) => idMap.get(e.id) as string) });
}

export type AlignMode = "left" | "center" | "top" | "middle";

/** Aligns the selected nodes' boxes on the first selected node (layout positions are centres). */
export function alignSelection(mode: AlignMode, sizes: Record<string, { w: number; h: number }>): void {
  const { doc, applyChanges } = useDocumentStore.getState();
  const ids = useSessionStore.getState().selection.filter((id) => ownValue(doc.layout, id));
  if (ids.length < 2) return;
  const ref = ownValue(doc.layout, ids[0])!;
  const refSize = sizes[ids[0]] ?? { w: 0, h: 0 };
  const places: Record<string, NodePlace> = {};
  for (const id of ids.slice(1)) {
    const p = ownValue(doc.layout, id)!;
    const s = sizes[id] ?? { w: 0, h: 0 };
    if (mode === "left") places[id] = { x: ref.x - refSize.w / 2 + s.w / 2, y: p.y };
    if (mode === "center") places[id] = { x: ref.x, y: p.y };
    if (mode === "top") places[id] = { x: p.x, y: ref.y - refSize.h / 2 + s.h / 2 };
    if (mode === "middle") places[id] = { x: p.x, y: ref.y };
  }
  applyChanges([{ type: "moveNodes", places }], { undoable: true });
}
