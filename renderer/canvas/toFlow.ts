// Builds the one-line's nodes and edges from the document, the selection and the fault overlay.
// Buses are nodes; every other network element is a node tied to its buses by edges; protective
// devices are drawn inside the node they look into.
import { isProtectiveDevice, type Bus, type Element, type Project, type ProtectiveDevice } from "../../src/model/schema.ts";
import { ownValue } from "../../src/model/ownValue.ts";
import type { FaultOverlay } from "../fault/overlayTypes.ts";
import type { OneLineEdge, OneLineNode } from "./flowTypes.ts";
import { toneColor, voltageTone } from "./voltageTone.ts";
import { BRANCH_BOX, SHUNT_BOX } from "./symbols/ElementSymbol.tsx";
import { BUS_HEIGHT } from "./nodes/BusNode.tsx";
import { elementCaption } from "./elementCaption.ts";

export const DEFAULT_BUS_WIDTH = 240;

/** Terminal handle id -> the element field holding that terminal's bus. */
export function terminalFields(e: Element): { a?: string; b?: string } {
  switch (e.kind) {
    case "transformer":
      return { a: "hvBus", b: "lvBus" };
    case "line":
      return { a: "fromBus", b: "toBus" };
    case "switch":
      return { a: "busA", b: "busB" };
    case "bus":
    case "relay":
    case "fuse":
    case "lvbreaker":
      return {};
    default:
      return { a: "bus" };
  }
}

export function isBranchLike(e: Element): boolean {
  return e.kind === "transformer" || e.kind === "line" || e.kind === "switch";
}

export const HORIZONTAL_BOX = { w: BRANCH_BOX.h, h: BRANCH_BOX.w } as const;

export function nodeSize(e: Element, width?: number, horizontal = false): { w: number; h: number } {
  if (e.kind === "bus") return { w: width ?? DEFAULT_BUS_WIDTH, h: BUS_HEIGHT };
  if (!isBranchLike(e)) return SHUNT_BOX;
  return horizontal ? HORIZONTAL_BOX : BRANCH_BOX;
}

const SAME_ROW_PX = 30;

/** Layout positions are node centres. A branch whose two buses sit on its own row is drawn across. */
export function isHorizontal(e: Element, layout: Project["layout"]): boolean {
  const place = ownValue(layout, e.id);
  if (!place || !isBranchLike(e)) return false;
  if (place.rot !== undefined) return Math.abs(place.rot % 180) === 90;
  const f = terminalFields(e);
  const rec = e as Record<string, unknown>;
  const a = ownValue(layout, String(rec[f.a ?? ""]));
  const b = ownValue(layout, String(rec[f.b ?? ""]));
  return !!a && !!b && Math.abs(a.y - place.y) < SAME_ROW_PX && Math.abs(b.y - place.y) < SAME_ROW_PX;
}

/** A shunt drawn above its bus has its terminal at the bottom. */
export function isDown(e: Element, layout: Project["layout"]): boolean {
  const f = terminalFields(e);
  const busId = f.a ? (e as Record<string, unknown>)[f.a] : undefined;
  const bus = typeof busId === "string" ? ownValue(layout, busId) : undefined;
  const place = ownValue(layout, e.id);
  if (!bus || !place) return e.kind === "grid";
  return place.y < bus.y;
}

const EMPTY: never[] = [];

export function toFlow(doc: Project, selection: readonly string[], overlay: FaultOverlay | null): { nodes: OneLineNode[]; edges: OneLineEdge[] } {
  const buses = new Map<string, Bus>();
  for (const e of doc.elements) if (e.kind === "bus") buses.set(e.id, e);
  const devicesAt = new Map<string, ProtectiveDevice[]>();
  for (const e of doc.elements) {
    if (!isProtectiveDevice(e)) continue;
    const key = `${e.at.element}:${e.at.end}`;
    devicesAt.set(key, [...(devicesAt.get(key) ?? []), e]);
  }
  const selected = new Set(selection);
  const colorOf = (busId: unknown) => toneColor(voltageTone(typeof busId === "string" ? buses.get(busId)?.un_kV : undefined));
  const nodes: OneLineNode[] = [];
  const edges: OneLineEdge[] = [];
  let unplaced = 0;
  for (const e of doc.elements) {
    if (isProtectiveDevice(e)) continue;
    const place = ownValue(doc.layout, e.id) ?? { x: 40 + (unplaced % 8) * 140, y: 40 + Math.floor(unplaced++ / 8) * 160 };
    if (e.kind === "bus") {
      const width = place.w ?? DEFAULT_BUS_WIDTH;
      nodes.push({
        id: e.id,
        type: "bus",
        position: { x: place.x, y: place.y },
        width,
        height: BUS_HEIGHT,
        // known sizes: a rebuilt node keeps them, so a drag never sees it unmeasured (centre origin)
        measured: { width, height: BUS_HEIGHT },
        selected: selected.has(e.id),
        data: {
          bus: e,
          color: colorOf(e.id),
          width,
          faulted: overlay?.at === e.id,
          ikss_kA: overlay?.at === e.id ? overlay.ikss_kA : null,
          voltage_pu: overlay ? (ownValue(overlay.busVoltages_pu, e.id) ?? null) : null,
        },
      });
      continue;
    }
    const fields = terminalFields(e);
    const rec = e as Record<string, unknown>;
    const branch = isBranchLike(e);
    const horizontal = branch && isHorizontal(e, doc.layout);
    const size = nodeSize(e, undefined, horizontal);
    const devicesA = devicesAt.get(`${e.id}:${branch ? "from" : "terminal"}`) ?? EMPTY;
    const devicesB = branch ? (devicesAt.get(`${e.id}:to`) ?? EMPTY) : EMPTY;
    const selectedDevices = [...devicesA, ...devicesB].filter((d) => selected.has(d.id)).map((d) => d.id);
    const marks: FaultOverlay["devices"] = Object.create(null); // keyed by device ids
    for (const d of overlay ? [...devicesA, ...devicesB] : EMPTY) {
      const mark = ownValue(overlay?.devices, d.id);
      if (mark) marks[d.id] = mark;
    }
    nodes.push({
      id: e.id,
      type: branch ? "branch" : "shunt",
      position: { x: place.x, y: place.y },
      width: size.w,
      height: size.h,
      measured: { width: size.w, height: size.h },
      selected: selected.has(e.id),
      data: {
        element: e,
        colorA: colorOf(fields.a ? rec[fields.a] : undefined),
        colorB: colorOf(fields.b ? rec[fields.b] : undefined),
        devicesA,
        devicesB,
        selectedDevices,
        caption: e.name || e.id,
        detail: elementCaption(e),
        flow: (overlay && ownValue(overlay.flows, e.id)) ?? null,
        marks,
        faulted: overlay?.at === e.id,
        ikss_kA: overlay?.at === e.id ? overlay.ikss_kA : null,
        down: !branch && isDown(e, doc.layout),
        horizontal,
      },
    } as OneLineNode);
    for (const handle of ["a", "b"] as const) {
      const field = fields[handle];
      const busId = field ? rec[field] : undefined;
      if (typeof busId !== "string" || !buses.has(busId)) continue;
      edges.push({
        id: `${e.id}:${handle}`,
        type: "tie",
        source: e.id,
        sourceHandle: handle,
        target: busId,
        targetHandle: "bus",
        selectable: false,
        data: { color: colorOf(busId), busId },
      });
    }
  }
  return { nodes, edges };
}
