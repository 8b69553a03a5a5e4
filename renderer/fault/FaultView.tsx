// "Fault view": the figures of the fault on the one-line: I"k, peak, breaking and thermal currents,
// and the bus voltages, with the engine's messages.
import { useFaultStore } from "./faultStore.ts";
import { useSessionStore } from "../store/sessionStore.ts";
import { fmt } from "../canvas/nodes/formatting.ts";
import { useDocumentStore } from "../store/documentStore.ts";
import { nameWithId } from "../app/caseNames.ts";

export function FaultView() {
  const { overlay, result, status, error } = useFaultStore();
  const target = useSessionStore((s) => s.faultTarget);
  const doc = useDocumentStore((s) => s.doc);
  if (!target) return <p className="pane-empty">Select a bus (or a cable) and press F, or use "Fault here", to see the fault currents on the one-line.</p>;
  if (status === "error") return <p className="pane-empty msg-error">{error}</p>;
  // while a recalculation runs the previous figures stay up, so the pane does not flicker on every edit
  if (!overlay || !result) return <p className="pane-empty">{status === "running" ? "Calculating…" : "No result yet."}</p>;
  return (
    <div className="fault-view" data-testid="fault-view">
      <h3>{overlay.label}</h3>
      <dl className="figures">
        <dt>I&quot;k</dt>
        <dd data-testid="fv-ikss">{fmt(result.ikss_kA, 4)} kA</dd>
        <dt>ip</dt>
        <dd>{fmt(result.ip_kA, 4)} kA (κ {fmt(result.kappa, 3)})</dd>
        <dt>Ib</dt>
        <dd>{fmt(result.ib_kA, 4)} kA</dd>
        <dt>Ith</dt>
        <dd>{fmt(result.ith_kA, 4)} kA</dd>
        <dt>c · Un</dt>
        <dd>
          {fmt(result.c, 3)} · {fmt(result.un_kV)} kV
        </dd>
        <dt>X/R</dt>
        <dd>{fmt(result.xr, 3)}</dd>
      </dl>
      <table className="data-table">
        <thead>
          <tr>
            <th>Bus</th>
            <th>Lowest phase voltage</th>
          </tr>
        </thead>
        <tbody>
          {result.buses.map((b) => (
            <tr key={b.bus}>
              <td>{nameWithId(doc, b.bus)}</td>
              <td>{b.energized ? `${fmt(Math.min(...b.phase_pu.map((p) => p.mag)) * 100)} %` : "not energised"}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {result.messages.length > 0 && (
        <ul className="field-messages block">
          {result.messages.map((m, i) => (
            <li key={i} className={`msg msg-${m.level === "error" ? "error" : m.level === "warning" ? "warning" : "info"}`}>
              {m.text}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
