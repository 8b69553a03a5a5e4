// What the protection did in the selected case, from the study's simulated operation: each device that
// tripped or opened, in time order, beside what the expected isolation asked for; the isolation time, what it
// cost, and the devices that acted without being expected. Clicking a step selects its device.
import type { CaseOperation } from "../../../src/study/types.ts";
import { formatTime_s } from "../shared/formatQuantity.ts";

const ACTION_WORDS: Record<CaseOperation["operations"][number]["action"], string> = {
  trip: "trips",
  open: "opens",
  melt: "melts",
  clear: "clears",
  stuck: "fails to open",
};

export interface OperationStepsProps {
  operation: CaseOperation;
  /** Display name of a device or element id. */
  nameOf: (id: string) => string;
  selectedDeviceId: string | null;
  onSelect: (deviceId: string) => void;
}

/** One line saying how the case ended. */
export function operationSummary(o: CaseOperation, nameOf: (id: string) => string): string {
  const lost = `${o.loadLost_kW.toFixed(0)} kW lost (expected isolation: ${o.idealLoadLost_kW.toFixed(0)} kW)`;
  if (o.isolated_s === null) return o.operations.length === 0 ? "Not isolated: nothing operates within the horizon" : "Not isolated within the horizon";
  const unwanted = o.unwanted.length ? `; unwanted: ${o.unwanted.map(nameOf).join(", ")}` : "";
  return `Isolated at ${formatTime_s(o.isolated_s)}; ${lost}${unwanted}`;
}

export function OperationSteps(props: OperationStepsProps) {
  const { operation: o, nameOf, selectedDeviceId, onSelect } = props;
  const expected = new Set(o.ideal);
  const unwanted = new Set(o.unwanted);
  return (
    <div className="operation-steps" data-testid="operation-steps">
      <p className={`operation-summary${o.isolated_s === null || o.unwanted.length ? " is-bad" : ""}`} data-testid="operation-summary">
        {operationSummary(o, nameOf)}
      </p>
      {o.restrained.length ? <p className="operation-note">Restrained by direction, as they should: {o.restrained.map(nameOf).join(", ")}; cleared from the far ends.</p> : null}
      {o.outOfReach.length ? <p className="operation-note">Fed by {o.outOfReach.map(nameOf).join(", ")}, which no device of the project can disconnect.</p> : null}
      {o.selfCeasing.length ? <p className="operation-note">{o.selfCeasing.map(nameOf).join(", ")}: grid-following, expected to cease on its own protection.</p> : null}
      {o.operations.length === 0 ? (
        <p className="ap-empty">No device operates.</p>
      ) : (
        <table className="chain-table operation-table">
          <thead>
            <tr>
              <th className="num">t</th>
              <th>Device</th>
              <th>Action</th>
              <th>Expected?</th>
            </tr>
          </thead>
          <tbody>
            {o.operations.map((s, k) => (
              <tr
                key={`${s.device}-${s.action}-${k}`}
                className={`operation-step${s.device === selectedDeviceId ? " is-current" : ""}${unwanted.has(s.device) ? " is-unwanted" : ""}`}
                onClick={() => onSelect(s.device)}
              >
                <td className="num">{formatTime_s(s.t_s)}</td>
                <td>{nameOf(s.device)}</td>
                <td>
                  {ACTION_WORDS[s.action]}
                  {s.element && s.action !== "trip" ? ` ${nameOf(s.element)}` : ""}
                </td>
                <td>{expected.has(s.device) ? "expected" : unwanted.has(s.device) ? <strong>unwanted</strong> : "—"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
