// The studio shell: command bar, parts palette, one-line, properties and operating modes,
// the lower panes, and the status area with the caution.
import { ownValue } from "../../src/model/ownValue.ts";
import { ReactFlowProvider, useReactFlow } from "@xyflow/react";
import type { ElementKind } from "../../src/model/schema.ts";
import { Toolbar } from "./Toolbar.tsx";
import { StatusBar } from "./StatusBar.tsx";
import { Notices } from "./Notices.tsx";
import { BottomPanes, type PaneEntry } from "./BottomPanes.tsx";
import { RecoveryOffer, type Recovery } from "./RecoveryOffer.tsx";
import { useKeyboard } from "./useKeyboard.ts";
import { OneLineCanvas } from "../canvas/OneLineCanvas.tsx";
import { Palette } from "../canvas/Palette.tsx";
import { Inspector } from "../inspector/Inspector.tsx";
import { OperatingModes } from "../modes/OperatingModes.tsx";
import { addElement, deviceLocationOn, isProtectiveKind, newPartSize } from "../canvas/editCommands.ts";
import { freeSpot } from "../canvas/freeSpot.ts";
import { useDocumentStore } from "../store/documentStore.ts";
import { useSessionStore, bottomFractionOf } from "../store/sessionStore.ts";
import { PaneSplitter } from "./PaneSplitter.tsx";

function Workspace({ panes }: { panes: PaneEntry[] }) {
  const flow = useReactFlow();
  const fraction = useSessionStore(bottomFractionOf);
  const enlarged = useSessionStore((s) => s.bottomEnlarged);
  useKeyboard();
  const onAdd = (kind: ElementKind) => {
    if (isProtectiveKind(kind)) {
      const { doc } = useDocumentStore.getState();
      const host = doc.elements.find((e) => e.id === useSessionStore.getState().selection[0]);
      addElement(kind, { x: 0, y: 0 }, host ? deviceLocationOn(host, false) : null);
      return;
    }
    // near the selected part (beside it), else the view's centre; then the nearest free spot
    const { doc } = useDocumentStore.getState();
    const near = useSessionStore.getState().selection.map((id) => ownValue(doc.layout, id)).find((p) => p !== undefined);
    const el = document.querySelector(".canvas-wrap")?.getBoundingClientRect();
    const want = near ? { x: near.x + (near.w ?? 0) / 2 + 80, y: near.y + 80 } : flow.screenToFlowPosition({ x: (el?.left ?? 0) + (el?.width ?? 800) / 2, y: (el?.top ?? 0) + (el?.height ?? 600) / 2 });
    addElement(kind, freeSpot(doc, want, newPartSize(kind), 10, kind === "bus"));
  };
  return (
    <div className="workspace">
      <Palette onAdd={onAdd} />
      <main className="center" style={{ gridTemplateRows: `minmax(0, 1fr) auto minmax(8rem, ${Math.round((enlarged ? 0.85 : fraction) * 1000) / 10}%)` }}>
        <OneLineCanvas />
        <PaneSplitter />
        <BottomPanes extra={panes} />
      </main>
      <aside className="side">
        <Inspector />
        <OperatingModes />
      </aside>
    </div>
  );
}

export function App({ recovery, panes = [] }: { recovery: Recovery | null; panes?: PaneEntry[] }) {
  return (
    <ReactFlowProvider>
      <div className="studio">
        <Toolbar />
        {recovery && <RecoveryOffer recovery={recovery} />}
        <Workspace panes={panes} />
        <StatusBar />
        <Notices />
      </div>
    </ReactFlowProvider>
  );
}
