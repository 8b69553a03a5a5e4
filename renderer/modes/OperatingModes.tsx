// "Operating modes": pick the active scenario and switch sources in and out of it.
import { useDocumentStore } from "../store/documentStore.ts";
import { useSessionStore } from "../store/sessionStore.ts";
import { isSource } from "../../src/model/schema.ts";

export function OperatingModes() {
  const doc = useDocumentStore((s) => s.doc);
  const apply = useDocumentStore((s) => s.applyChanges);
  const activeId = useSessionStore((s) => s.activeScenarioId);
  const set = useSessionStore((s) => s.set);
  const active = doc.scenarios.find((s) => s.id === activeId) ?? doc.scenarios[0];
  const sources = doc.elements.filter(isSource);
  const addMode = () => {
    const taken = new Set(doc.scenarios.map((s) => s.id));
    let n = doc.scenarios.length + 1;
    while (taken.has(`mode-${n}`)) n++;
    const scenario = { id: `mode-${n}`, name: `Mode ${n}`, outOfService: [...(active?.outOfService ?? [])], switchStates: { ...(active?.switchStates ?? {}) }, limits: ["max", "min"] as ("max" | "min")[] };
    apply([{ type: "addScenario", scenario }], { undoable: true });
    set({ activeScenarioId: scenario.id });
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
      </div>
      {active?.description && <p className="field-note">{active.description}</p>}
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
                  onChange={(e) => active && apply([{ type: "setOutOfService", scenarioId: active.id, elementId: src.id, out: !e.target.checked }], { undoable: true })}
                />
                <span className="source-name">{src.name || src.id}</span>
                <span className="source-state">{out ? "out" : "in"}</span>
              </label>
            </li>
          );
        })}
      </ul>
    </section>
  );
}
