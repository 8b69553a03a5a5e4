// "Operating modes": pick the active mode; name, describe, add and delete modes; switch sources in
// and out and set each switching device open or closed in the mode. Every edit is one undo step.
import { useDocumentStore, undo } from "../store/documentStore.ts";
import { useSessionStore } from "../store/sessionStore.ts";
import { isSource, type Scenario, type Switch } from "../../src/model/schema.ts";
import type { DocChange } from "../store/changes.ts";
import { TextInput } from "../inspector/FieldRow.tsx";

function tryApply(changes: DocChange[]): boolean {
  try {
    useDocumentStore.getState().applyChanges(changes, { undoable: true });
    return true;
  } catch (err) {
    useSessionStore.getState().notify("error", err instanceof Error ? err.message : String(err), undefined, { topic: "modes" });
    return false;
  }
}

function SwitchStates({ mode, switches }: { mode: Scenario; switches: Switch[] }) {
  if (switches.length === 0) return <p className="field-note">No switching devices (couplers, ties) yet.</p>;
  return (
    <ul className="source-list switch-list" aria-label="Switch states in this mode">
      {switches.map((sw) => {
        const override = mode.switchStates[sw.id];
        const value = override === undefined ? "drawn" : override ? "closed" : "open";
        const drawn = sw.closed ? "closed" : "open";
        const effective = override ?? sw.closed;
        return (
          <li key={sw.id} className={effective ? "is-in" : "is-out"}>
            <label>
              <span className="source-name">{sw.name || sw.id}</span>
              <select
                className="field-input switch-state"
                aria-label={`State of ${sw.name || sw.id} in this mode`}
                value={value}
                onChange={(e) => {
                  const v = e.target.value;
                  tryApply([{ type: "setSwitchState", scenarioId: mode.id, switchId: sw.id, closed: v === "drawn" ? null : v === "closed" }]);
                }}
              >
                <option value="drawn">as drawn ({drawn})</option>
                <option value="closed">closed</option>
                <option value="open">open</option>
              </select>
            </label>
          </li>
        );
      })}
    </ul>
  );
}

export function OperatingModes() {
  const doc = useDocumentStore((s) => s.doc);
  const activeId = useSessionStore((s) => s.activeScenarioId);
  const set = useSessionStore((s) => s.set);
  const active = doc.scenarios.find((s) => s.id === activeId) ?? doc.scenarios[0];
  const sources = doc.elements.filter(isSource);
  const switches = doc.elements.filter((e): e is Switch => e.kind === "switch");
  const addMode = () => {
    const taken = new Set(doc.scenarios.map((s) => s.id));
    let n = doc.scenarios.length + 1;
    while (taken.has(`mode-${n}`)) n++;
    const scenario = { id: `mode-${n}`, name: `Mode ${n}`, outOfService: [...(active?.outOfService ?? [])], switchStates: { ...(active?.switchStates ?? {}) }, limits: ["max", "min"] as ("max" | "min")[] };
    if (tryApply([{ type: "addScenario", scenario }])) set({ activeScenarioId: scenario.id });
  };
  const deleteMode = () => {
    if (!active) return;
    const index = doc.scenarios.findIndex((s) => s.id === active.id);
    if (!tryApply([{ type: "removeScenario", scenarioId: active.id }])) return;
    const next = doc.scenarios[index + 1] ?? doc.scenarios[index - 1];
    set({ activeScenarioId: next?.id ?? null });
    useSessionStore.getState().notify("info", `Deleted the operating mode "${active.name}".`, undefined, { topic: "modes", action: { label: "Undo", run: undoDelete(active.id) } });
  };
  return (
    <section className="modes" aria-label="Operating modes">
      <h2 className="pane-title">Operating modes</h2>
      <div className="modes-row">
        <select aria-label="Active operating mode" className="field-input" value={active?.id ?? ""} onChange={(e) => set({ activeScenarioId: e.target.value })} data-testid="mode-select">
          {doc.scenarios.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </select>
        <button className="small-button" onClick={addMode} title="A new mode starting from the active one">
          + Mode
        </button>
        <button className="small-button" onClick={deleteMode} disabled={!active || doc.scenarios.length <= 1} title={doc.scenarios.length <= 1 ? "A project keeps at least one mode" : "Delete this mode (Ctrl+Z brings it back)"}>
          Delete
        </button>
      </div>
      {active && (
        <div className="inspector-body modes-fields">
          <div className="field-row">
            <label className="field-label">Name</label>
            <div className="field-control">
              <TextInput label="Mode name" value={active.name} readOnly={false} onCommit={(name) => tryApply([{ type: "updateScenario", scenarioId: active.id, patch: { name } }])} />
            </div>
          </div>
          <div className="field-row">
            <label className="field-label">Description</label>
            <div className="field-control">
              <TextInput label="Mode description" value={active.description ?? ""} readOnly={false} onCommit={(description) => tryApply([{ type: "updateScenario", scenarioId: active.id, patch: { description } }])} />
            </div>
          </div>
        </div>
      )}
      <h3 className="modes-subtitle">Sources in service</h3>
      <ul className="source-list">
        {sources.length === 0 && <li className="field-note">No sources yet.</li>}
        {sources.map((src) => {
          const out = active?.outOfService.includes(src.id) ?? false;
          return (
            <li key={src.id} className={out ? "is-out" : "is-in"}>
              <label>
                <input
                  type="checkbox"
                  checked={!out}
                  disabled={!active}
                  onChange={(e) => active && tryApply([{ type: "setOutOfService", scenarioId: active.id, elementId: src.id, out: !e.target.checked }])}
                />
                <span className="source-name">{src.name || src.id}</span>
                <span className="source-state">{out ? "out" : "in"}</span>
              </label>
            </li>
          );
        })}
      </ul>
      <h3 className="modes-subtitle">Switching devices</h3>
      {active && <SwitchStates mode={active} switches={switches} />}
    </section>
  );
}

/** Undo of a mode deletion from its notice: one undo step, then the mode is active again. */
function undoDelete(scenarioId: string): () => void {
  return () => {
    const before = useDocumentStore.getState().doc;
    if (before.scenarios.some((s) => s.id === scenarioId)) return;
    undo();
    if (useDocumentStore.getState().doc.scenarios.some((s) => s.id === scenarioId)) useSessionStore.getState().set({ activeScenarioId: scenarioId });
  };
}
