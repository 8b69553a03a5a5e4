// The command bar: file, edit, arrange, fault and study commands, theme.
import { ownValue } from "../../src/model/ownValue.ts";
import { useEffect, useState, type MouseEvent } from "react";
import { useStore } from "zustand";
import type { FileRef } from "../../src/model/hostContract.ts";
import { FAULT_TYPES, type FaultLimit, type FaultType } from "../../src/study/types.ts";
import { useDocumentStore, undo, redo } from "../store/documentStore.ts";
import { useSessionStore, setViewPreference } from "../store/sessionStore.ts";
import { newDocument, openDocument, openDemo, openRecentDocument, saveDocument } from "../files/fileCommands.ts";
import { currentHost } from "../host/currentHost.ts";
import { alignSelection, copySelection, deleteSelection, paste, type AlignMode } from "../canvas/editCommands.ts";
import { nodeSize } from "../canvas/toFlow.ts";
import { autoLayout } from "../canvas/autoLayout.ts";
import { faultAtSelection } from "./faultCommands.ts";
import { StudyControl } from "./StudyControl.tsx";
import { saveReport } from "../files/saveReport.ts";
import { commitPendingEdits } from "./pendingEdits.ts";

const FAULT_WORDS: Record<FaultType, string> = { "3ph": "Three-phase", LL: "Line-line", LG: "Line-earth", LLG: "Line-line-earth" };

/** A chosen menu item closes its menu (a <details> would otherwise stay open over the one-line). */
function closeMenuOnChoice(e: MouseEvent<HTMLElement>): void {
  if ((e.target as Element).closest(".menu-item")) e.currentTarget.closest("details")?.removeAttribute("open");
}

/** Open menus close on Escape and on a press anywhere outside them. */
function useMenuDismissal(): void {
  useEffect(() => {
    const closeAll = (except?: Element | null) => {
      for (const m of document.querySelectorAll("details.menu[open]")) if (m !== except) m.removeAttribute("open");
    };
    const onPointer = (e: PointerEvent) => closeAll((e.target as Element | null)?.closest?.("details.menu") ?? null);
    const onKey = (e: KeyboardEvent) => {
      if (e.key !== "Escape" || !document.querySelector("details.menu[open]")) return;
      closeAll();
      // the Escape closed a menu: it does not also clear the fault or the selection
      e.stopPropagation();
    };
    document.addEventListener("pointerdown", onPointer, true);
    window.addEventListener("keydown", onKey, true);
    return () => {
      document.removeEventListener("pointerdown", onPointer, true);
      window.removeEventListener("keydown", onKey, true);
    };
  }, []);
}

/** View settings kept per user, never in the project: the mini-map and the developer figures. */
function ViewMenu() {
  const showMiniMap = useSessionStore((s) => s.showMiniMap);
  const diagnostics = useSessionStore((s) => s.diagnostics);
  return (
    <details className="menu">
      <summary className="tool-button">View</summary>
      <div className="menu-list menu-right" data-testid="view-menu">
        <label className="menu-item menu-check">
          <input type="checkbox" checked={showMiniMap} onChange={(e) => setViewPreference("showMiniMap", e.target.checked)} /> Overview map
        </label>
        <label className="menu-item menu-check" title="Developer figures such as the time from an edit to the updated fault overlay">
          <input type="checkbox" checked={diagnostics} onChange={(e) => setViewPreference("diagnostics", e.target.checked)} /> Diagnostics in the status bar
        </label>
      </div>
    </details>
  );
}

function RecentMenu() {
  const [files, setFiles] = useState<FileRef[] | null>(null);
  return (
    <details className="menu" onToggle={(e) => (e.currentTarget.open ? void currentHost().listRecent().then(setFiles) : setFiles(null))}>
      <summary className="tool-button">Recent</summary>
      <div className="menu-list" data-testid="recent-list" onClick={closeMenuOnChoice}>
        {files === null || files.length === 0 ? (
          <span className="menu-empty">No recent files</span>
        ) : (
          files.map((f) => (
            <button key={f.key} className="menu-item" onClick={() => void openRecentDocument(f)}>
              {f.name}
            </button>
          ))
        )}
      </div>
    </details>
  );
}

function arrangeAll(): void {
  const { doc, applyChanges } = useDocumentStore.getState();
  void autoLayout(doc).then((layout) => {
    applyChanges([{ type: "moveNodes", places: layout }], { undoable: true });
    const s = useSessionStore.getState();
    s.set({ fitSeq: s.fitSeq + 1 });
  });
}

function align(mode: AlignMode): void {
  const { doc } = useDocumentStore.getState();
  const sizes: Record<string, { w: number; h: number }> = {};
  for (const e of doc.elements) sizes[e.id] = nodeSize(e, ownValue(doc.layout, e.id)?.w);
  alignSelection(mode, sizes);
}

export function Toolbar() {
  const canUndo = useStore(useDocumentStore.temporal, (s) => s.pastStates.length > 0);
  const canRedo = useStore(useDocumentStore.temporal, (s) => s.futureStates.length > 0);
  const session = useSessionStore();
  const hasSelection = session.selection.length > 0;
  useMenuDismissal();
  useEffect(() => {
    document.documentElement.dataset.theme = session.theme;
  }, [session.theme]);
  return (
    <header className="toolbar" role="toolbar">
      <span className="brand" aria-label="Islet">
        <svg width="22" height="22" viewBox="0 0 22 22" aria-hidden>
          <path d="M2 15 Q6 8 11 11 T20 9" fill="none" stroke="currentColor" strokeWidth="2" />
          <circle cx="11" cy="11" r="3" fill="currentColor" />
        </svg>
        Islet
      </span>
      <div className="tool-group" aria-label="File">
        <button className="tool-button" onClick={() => void newDocument()}>New</button>
        <button className="tool-button" onClick={() => void openDocument()}>Open…</button>
        <button className="tool-button" onClick={() => (commitPendingEdits(), void saveDocument(false))} title="Ctrl+S">Save</button>
        <button className="tool-button" onClick={() => (commitPendingEdits(), void saveDocument(true))} title="Ctrl+Shift+S">Save as…</button>
        <RecentMenu />
        <button className="tool-button" onClick={() => void openDemo()}>Demo</button>
      </div>
      <div className="tool-group" aria-label="Edit">
        <button className="tool-button" onClick={undo} disabled={!canUndo} title="Ctrl+Z">Undo</button>
        <button className="tool-button" onClick={redo} disabled={!canRedo} title="Ctrl+Y">Redo</button>
        <button className="tool-button" onClick={copySelection} disabled={!hasSelection} title="Ctrl+C">Copy</button>
        <button className="tool-button" onClick={() => paste()} disabled={!session.clipboard} title="Ctrl+V">Paste</button>
        <button className="tool-button" onClick={deleteSelection} disabled={!hasSelection} title="Delete">Delete</button>
      </div>
      <div className="tool-group" aria-label="Arrange">
        <details className="menu">
          <summary className="tool-button">Align</summary>
          <div className="menu-list" onClick={closeMenuOnChoice}>
            <button className="menu-item" onClick={() => align("left")}>Left edges</button>
            <button className="menu-item" onClick={() => align("center")}>Vertical centres</button>
            <button className="menu-item" onClick={() => align("top")}>Top edges</button>
            <button className="menu-item" onClick={() => align("middle")}>Horizontal centres</button>
          </div>
        </details>
        <button className="tool-button" onClick={arrangeAll} title="Lay the whole diagram out automatically">Arrange</button>
        <label className="tool-check">
          <input type="checkbox" checked={session.snapToGrid} onChange={(e) => session.set({ snapToGrid: e.target.checked })} /> Snap
        </label>
      </div>
      <div className="tool-group" aria-label="Fault">
        <select aria-label="Fault type" value={session.faultType} onChange={(e) => session.set({ faultType: e.target.value as FaultType })} data-testid="fault-type">
          {FAULT_TYPES.map((t) => (
            <option key={t} value={t}>{FAULT_WORDS[t]}</option>
          ))}
        </select>
        <select aria-label="Calculation" value={session.faultLimit} onChange={(e) => session.set({ faultLimit: e.target.value as FaultLimit })} data-testid="fault-limit">
          <option value="max">Maximum</option>
          <option value="min">Minimum</option>
        </select>
        <button className="tool-button accent" onClick={faultAtSelection} title="F" data-testid="fault-here">Fault here</button>
        {session.faultTarget?.kind === "line" && (
          <label className="tool-check" title="Fault position along the line, percent of its length from its from-bus">
            at
            <input
              type="number"
              className="pct-input"
              min={1}
              max={99}
              step={1}
              value={session.faultTarget.pct}
              aria-label="Fault position along the line"
              onChange={(e) => {
                const pct = Math.min(99, Math.max(1, Number(e.target.value) || 50));
                const t = session.faultTarget;
                if (t?.kind === "line") session.set({ faultTarget: { ...t, pct } });
              }}
            />
            %
          </label>
        )}
        {session.faultTarget && (
          <button className="tool-button" onClick={() => session.set({ faultTarget: null })} title="Esc">Clear fault</button>
        )}
      </div>
      <StudyControl />
      <div className="tool-group" aria-label="Report">
        <button className="tool-button" onClick={() => (commitPendingEdits(), void saveReport())} title="Run the study if needed and save the study report" data-testid="report">Report</button>
      </div>
      <div className="tool-spacer" />
      <ViewMenu />
      <button className="tool-button" onClick={() => session.set({ theme: session.theme === "light" ? "dark" : "light" })} aria-label="Switch theme">
        {session.theme === "light" ? "Dark" : "Light"}
      </button>
    </header>
  );
}
