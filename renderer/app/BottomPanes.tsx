// The tabbed lower area: Fault view, Chain, Time-current and Verdicts. The last three are
// built as separate pane components and mounted here when present.
import type { ReactNode } from "react";
import { useSessionStore, type PaneId } from "../store/sessionStore.ts";
import { FaultView } from "../fault/FaultView.tsx";

export interface PaneEntry {
  id: PaneId;
  title: string;
  render(): ReactNode;
}

const BASE_PANES: PaneEntry[] = [{ id: "fault", title: "Fault view", render: () => <FaultView /> }];

export function BottomPanes({ extra = [] }: { extra?: PaneEntry[] }) {
  const pane = useSessionStore((s) => s.pane);
  const set = useSessionStore((s) => s.set);
  const enlarged = useSessionStore((s) => s.bottomEnlarged);
  const panes = [...BASE_PANES, ...extra];
  const current = panes.find((p) => p.id === pane) ?? panes[0];
  return (
    <section className="bottom-panes">
      <div className="tabs" role="tablist">
        {panes.map((p) => (
          <button key={p.id} role="tab" aria-selected={p.id === current.id} className={`tab${p.id === current.id ? " is-active" : ""}`} onClick={() => set({ pane: p.id })} data-testid={`tab-${p.id}`}>
            {p.title}
          </button>
        ))}
        <span className="tabs-spacer" />
        <button className="tab-tool" onClick={() => set({ bottomEnlarged: !enlarged })} aria-pressed={enlarged} data-testid="pane-enlarge" title={enlarged ? "Give the one-line its space back" : "Enlarge this pane over the one-line"}>
          {enlarged ? "Restore" : "Enlarge"}
        </button>
      </div>
      <div className="pane-body" role="tabpanel">
        {current.render()}
      </div>
    </section>
  );
}
