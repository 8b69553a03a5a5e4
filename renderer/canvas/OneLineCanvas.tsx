// The one-line editor: nodes and ties built from the document, drags kept local until the drop
// (one undo step), connections and palette drops turned into document changes.
import { ownValue } from "../../src/model/ownValue.ts";
import { useCallback, useEffect, useMemo, useRef, useState, type CSSProperties, type DragEvent } from "react";
import {
  ReactFlow,
  Background,
  BackgroundVariant,
  Controls,
  MiniMap,
  ConnectionMode,
  useReactFlow,
  useStore,
  type Connection,
  type NodeChange,
  type NodeTypes,
  type EdgeTypes,
} from "@xyflow/react";
import type { ElementKind } from "../../src/model/schema.ts";
import { useDocumentStore } from "../store/documentStore.ts";
import { useSessionStore } from "../store/sessionStore.ts";
import { useFaultStore } from "../fault/faultStore.ts";
import type { NodePlace } from "../store/changes.ts";
import type { OneLineEdge, OneLineNode } from "./flowTypes.ts";
import { stableItems } from "./stableItems.ts";
import { toFlow, terminalFields } from "./toFlow.ts";
import { BusNode, BUS_HEIGHT } from "./nodes/BusNode.tsx";
import { BranchNode } from "./nodes/BranchNode.tsx";
import { ShuntNode } from "./nodes/ShuntNode.tsx";
import { TieEdge } from "./TieEdge.tsx";
import { addElement, deviceLocationOn, isProtectiveKind, newPartSize } from "./editCommands.ts";
import { freeSpot } from "./freeSpot.ts";
import { PALETTE_DRAG_TYPE } from "./Palette.tsx";

const nodeTypes: NodeTypes = { bus: BusNode, branch: BranchNode, shunt: ShuntNode };
const edgeTypes: EdgeTypes = { tie: TieEdge };
const GRID = 10;
const FAR_ZOOM = 0.4;
/** Below this, symbols are a few pixels wide: only bus bars and ties are drawn. */
const TINY_ZOOM = 0.15;
/** Canvas text keeps at least this size on screen: below a zoom of 1, names grow in flow units
 * (up to MAX_TEXT_SCALE) so the fitted view stays legible. // common practice: ~10 px is the least
 * that reads comfortably on a desktop screen */
const MIN_TEXT_PX = 10;
const BASE_NAME_PX = 11;
// beyond this (a small pane, far out) names would cover one another: they shrink with the drawing
const MAX_TEXT_SCALE = 1.6;
/** Above this scale the rating lines give way to the names (hover or select to read them). */
const DETAIL_SCALE = 1.2;
/** Layout positions in the document are node centres. */
const NODE_ORIGIN: [number, number] = [0.5, 0.5];

export function OneLineCanvas() {
  const doc = useDocumentStore((s) => s.doc);
  const applyChanges = useDocumentStore((s) => s.applyChanges);
  const selection = useSessionStore((s) => s.selection);
  const snap = useSessionStore((s) => s.snapToGrid);
  const theme = useSessionStore((s) => s.theme);
  const fitSeq = useSessionStore((s) => s.fitSeq);
  const overlay = useFaultStore((s) => s.overlay);
  const flow = useReactFlow();
  // level of detail: far out, labels and device markers are dropped (they would be unreadable)
  const far = useStore((s) => s.transform[2] < FAR_ZOOM);
  const tiny = useStore((s) => s.transform[2] < TINY_ZOOM);
  const textScale = useStore((s) => Math.round(Math.min(MAX_TEXT_SCALE, Math.max(1, MIN_TEXT_PX / (BASE_NAME_PX * s.transform[2]))) * 20) / 20);
  const showMiniMap = useSessionStore((s) => s.showMiniMap);
  const wrapRef = useRef<HTMLDivElement>(null);
  /** True while the view is the fitted one: a resize (window, splitter) then fits again. */
  const fitted = useRef(false);
  const [dragPlaces, setDragPlaces] = useState<Record<string, NodePlace>>({});
  const dragRef = useRef(dragPlaces);
  dragRef.current = dragPlaces;

  const previous = useRef<{ nodes: OneLineNode[]; edges: OneLineEdge[] }>({ nodes: [], edges: [] });
  const built = useMemo(() => {
    const next = toFlow(doc, selection, overlay);
    const stable = { nodes: stableItems(previous.current.nodes, next.nodes), edges: stableItems(previous.current.edges, next.edges) };
    previous.current = stable;
    return stable;
  }, [doc, selection, overlay]);
  const nodes = useMemo(() => {
    if (Object.keys(dragPlaces).length === 0) return built.nodes;
    return built.nodes.map((n) => (dragPlaces[n.id] ? ({ ...n, position: { x: dragPlaces[n.id].x, y: dragPlaces[n.id].y } } as OneLineNode) : n));
  }, [built.nodes, dragPlaces]);

  // a new document: fit it in view, never enlarging past 1:1; an empty one starts at 1:1. The
  // overview map sits in the top right corner: the fit keeps the diagram clear of it.
  const fit = useCallback(() => {
    if (useDocumentStore.getState().doc.elements.length === 0) void flow.setViewport({ x: 0, y: 0, zoom: 1 });
    else void flow.fitView({ padding: { top: 0.03, bottom: 0.03, left: 0.03, right: useSessionStore.getState().showMiniMap ? "170px" : 0.03 }, maxZoom: 1, duration: 0 });
    fitted.current = true;
  }, [flow]);
  useEffect(() => {
    if (fitSeq === 0) return;
    requestAnimationFrame(fit);
  }, [fitSeq, fit]);

  // stepping through a case: pan to the element the step's device sits at when it is out of view (zoom kept)
  const follow = useSessionStore((s) => s.follow);
  useEffect(() => {
    if (!follow) return;
    const device = useDocumentStore.getState().doc.elements.find((e) => e.id === follow.device);
    const hostId = device && (device.kind === "relay" || device.kind === "fuse" || device.kind === "lvbreaker") ? device.at.element : follow.device;
    const node = flow.getNode(hostId);
    const box = wrapRef.current?.getBoundingClientRect();
    if (!node || !box) return;
    const w = node.measured?.width ?? node.width ?? 0;
    const h = node.measured?.height ?? node.height ?? 0;
    const { x, y, zoom } = flow.getViewport();
    const cx = node.position.x + w / 2;
    const cy = node.position.y + h / 2;
    const sx = cx * zoom + x;
    const sy = cy * zoom + y;
    const margin = 40;
    if (sx < margin || sy < margin || sx > box.width - margin || sy > box.height - margin) void flow.setCenter(cx, cy, { zoom, duration: 200 });
  }, [follow, flow]);
  useEffect(() => {
    const el = wrapRef.current;
    if (!el || typeof ResizeObserver === "undefined") return;
    let frame = 0;
    const observer = new ResizeObserver(() => {
      cancelAnimationFrame(frame);
      frame = requestAnimationFrame(() => fitted.current && fit());
    });
    observer.observe(el);
    return () => {
      cancelAnimationFrame(frame);
      observer.disconnect();
    };
  }, [fit]);

  const onNodesChange = useCallback(
    (changes: NodeChange<OneLineNode>[]) => {
      let selectionNext: Set<string> | null = null;
      const moving: Record<string, NodePlace> = {};
      let finished = false;
      for (const c of changes) {
        if (c.type === "select") {
          selectionNext ??= new Set(useSessionStore.getState().selection);
          if (c.selected) selectionNext.add(c.id);
          else selectionNext.delete(c.id);
        } else if (c.type === "position" && c.position) {
          // the flow snaps a node's corner; the document keeps centres, so snap the centre as a drop does
          moving[c.id] = useSessionStore.getState().snapToGrid ? { x: Math.round(c.position.x / GRID) * GRID, y: Math.round(c.position.y / GRID) * GRID } : { x: c.position.x, y: c.position.y };
          if (!c.dragging) finished = true;
        } else if (c.type === "position" && c.dragging === false) {
          finished = true;
        }
      }
      if (selectionNext) useSessionStore.getState().set({ selection: [...selectionNext] });
      const merged = { ...dragRef.current, ...moving };
      if (finished) {
        if (Object.keys(merged).length > 0) applyChanges([{ type: "moveNodes", places: merged }], { undoable: true });
        setDragPlaces({});
      } else if (Object.keys(moving).length > 0) {
        setDragPlaces(merged);
      }
    },
    [applyChanges],
  );

  const onConnect = useCallback(
    (c: Connection) => {
      const { doc: current } = useDocumentStore.getState();
      const byId = new Map(current.elements.map((e) => [e.id, e]));
      const s = byId.get(c.source);
      const t = byId.get(c.target);
      if (!s || !t) return;
      const [bus, other, handle] = s.kind === "bus" ? [s, t, c.targetHandle] : [t, s, c.sourceHandle];
      if (bus.kind !== "bus" || other.kind === "bus") {
        useSessionStore.getState().notify("info", "Connect an element's terminal to a bus.");
        return;
      }
      const field = terminalFields(other)[(handle ?? "a") as "a" | "b"];
      if (!field) return;
      applyChanges([{ type: "setField", id: other.id, path: [field], value: bus.id }], { undoable: true });
    },
    [applyChanges],
  );

  const onDragOver = useCallback((e: DragEvent) => {
    if (e.dataTransfer.types.includes(PALETTE_DRAG_TYPE)) {
      e.preventDefault();
      e.dataTransfer.dropEffect = "copy";
      setPlacing(true);
    }
  }, []);

  const onDrop = useCallback(
    (e: DragEvent) => {
      const kind = e.dataTransfer.getData(PALETTE_DRAG_TYPE) as ElementKind;
      if (!kind) return;
      e.preventDefault();
      setPlacing(false);
      const p = flow.screenToFlowPosition({ x: e.clientX, y: e.clientY });
      const snapped = { x: Math.round(p.x / GRID) * GRID, y: Math.round(p.y / GRID) * GRID };
      if (isProtectiveKind(kind)) {
        const hit = flow.getIntersectingNodes({ x: p.x - 2, y: p.y - 2, width: 4, height: 4 });
        const host = hit.map((n) => useDocumentStore.getState().doc.elements.find((x) => x.id === n.id)).find((x) => x && x.kind !== "bus");
        if (!host) {
          useSessionStore.getState().notify("info", "Drop a protective device on a branch or on a source, motor or load.");
          return;
        }
        const node = flow.getInternalNode(host.id);
        const lower = node ? p.y > node.internals.positionAbsolute.y + (node.measured.height ?? node.height ?? 0) / 2 : false;
        addElement(kind, snapped, deviceLocationOn(host, lower));
        return;
      }
      // dropped on a bus: tied to it, hung below it (a grid feeder above it), on free ground
      const doc = useDocumentStore.getState().doc;
      const size = newPartSize(kind);
      const bus = kind === "bus" ? undefined : flow.getIntersectingNodes({ x: p.x - 2, y: p.y - 2, width: 4, height: 4 }).find((n) => n.type === "bus");
      if (bus) {
        const place = ownValue(doc.layout, bus.id);
        const offset = BUS_HEIGHT / 2 + size.h / 2 + 30;
        const want = { x: snapped.x, y: (place?.y ?? snapped.y) + (kind === "grid" ? -offset : offset) };
        addElement(kind, freeSpot(doc, want, size), null, bus.id);
        return;
      }
      addElement(kind, freeSpot(doc, snapped, size, 10, kind === "bus"));
    },
    [flow],
  );
  const connecting = useStore((s) => s.connection.inProgress);
  const [placing, setPlacing] = useState(false);

  return (
    <div
      ref={wrapRef}
      className={`canvas-wrap${far ? " lod-far" : ""}${tiny ? " lod-tiny" : ""}${textScale > DETAIL_SCALE ? " lod-names" : ""}${placing || connecting ? " is-placing" : ""}`}
      style={{ "--text-scale": textScale } as CSSProperties}
      data-testid="one-line"
      onDragOver={onDragOver}
      onDragLeave={(e) => {
        if (!e.currentTarget.contains(e.relatedTarget as Node | null)) setPlacing(false);
      }}
      onDrop={onDrop}
    >
      <ReactFlow<OneLineNode>
        nodes={nodes}
        edges={built.edges}
        nodeTypes={nodeTypes}
        edgeTypes={edgeTypes}
        onNodesChange={onNodesChange}
        onConnect={onConnect}
        connectionMode={ConnectionMode.Loose}
        nodeOrigin={NODE_ORIGIN}
        snapToGrid={snap}
        snapGrid={[GRID, GRID]}
        deleteKeyCode={null}
        selectionKeyCode="Shift"
        multiSelectionKeyCode={["Shift", "Control", "Meta"]}
        onPaneClick={() => useSessionStore.getState().set({ selection: [] })}
        onNodeDoubleClick={(_e, node) => {
          // fault on click: a double click on a bus or a line places the fault there
          if (node.type === "bus") useSessionStore.getState().set({ selection: [node.id], faultTarget: { kind: "bus", bus: node.id } });
          else if (node.type === "branch" && node.data.element.kind === "line") useSessionStore.getState().set({ selection: [node.id], faultTarget: { kind: "line", line: node.id, pct: 50 } });
        }}
        zoomOnDoubleClick={false}
        onNodeClick={(e, node) => {
          // devices are not nodes: a plain click makes the clicked node the only selection
          if (e.shiftKey || e.ctrlKey || e.metaKey) return;
          useSessionStore.getState().set({ selection: [node.id] });
        }}
        onlyRenderVisibleElements={doc.elements.length > 300}
        onMoveStart={(event) => {
          // a pan or zoom by the user ends the fitted view (a resize then keeps the user's view)
          if (event) fitted.current = false;
        }}
        minZoom={0.05}
        maxZoom={4}
        colorMode={theme}
        proOptions={{ hideAttribution: true }}
      >
        <Background variant={BackgroundVariant.Dots} gap={GRID * 2} size={1} />
        {showMiniMap && <MiniMap pannable zoomable position="top-right" className="minimap" nodeStrokeWidth={2} style={{ width: 140, height: 96 }} ariaLabel="Overview map" />}
        <Controls showInteractive={false} />
      </ReactFlow>
    </div>
  );
}
