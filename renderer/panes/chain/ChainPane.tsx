// The operation pane: for the selected case, the expected isolation (each device that must open, with its
// backups after it: the devices that isolate the fault when its breaker sticks) beside what the protection
// did in the simulation, in time order. Arrow keys step through the expected devices (Up/Down along one
// device's backups, Left/Right between expected devices); the current step is highlighted and reported so the
// canvas and the time-current pane follow.
import { useEffect, useId, useMemo, useRef, useState, type KeyboardEvent } from "react";
import type { CaseOperation, DeviceResponse, FaultChains, Verdict } from "../../../src/study/types.ts";
import { OperationSteps } from "./OperationSteps.tsx";
import { clampCursor, cursorForDevice, isChainKey, moveChainCursor, type ChainCursor } from "./chainCursor.ts";
import { linkStatuses } from "./linkStatus.ts";
import { STATUS_LABEL, type VerdictStatus } from "../shared/verdictStatus.ts";
import { formatCurrent_A, formatTime_s } from "../shared/formatQuantity.ts";
import "../panes.css";

export interface ChainPaneProps {
  /** Chains of the selected fault case (src/study FaultChains); null when no case is selected. */
  chains: FaultChains | null;
  /** Label of the selected case, shown in the header. */
  caseLabel?: string;
  /** Device responses of the case: supply the operating time (relay or trip-unit time, fuse melting time). */
  responses?: readonly DeviceResponse[];
  /** Verdicts (any case; only those of this case are used) that colour each step. */
  verdicts?: readonly Verdict[];
  /** Device of the current step as the shell knows it (e.g. picked on the canvas); the pane follows it. */
  selectedDeviceId?: string | null;
  /** The current step changed (keyboard or click): highlight this device everywhere. */
  onStepChange?: (deviceId: string) => void;
  /** The case's expected and simulated operation. */
  operation?: CaseOperation | null;
  /** Display name of an element id (defaults to the id). */
  nameOf?: (id: string) => string;
}

const KIND_LABEL: Record<string, string> = { grid: "utility tie", generator: "generator", inverter: "inverter" };

export function ChainPane(props: ChainPaneProps) {
  const { chains, responses = [], verdicts = [], selectedDeviceId = null, onStepChange, operation = null } = props;
  const nameOf = props.nameOf ?? ((id: string) => id);
  const paths = useMemo(() => chains?.paths ?? [], [chains]);
  const [cursor, setCursor] = useState<ChainCursor | null>(null);
  const bodyRef = useRef<HTMLDivElement>(null);
  const baseId = `chain${useId().replace(/[^A-Za-z0-9]/g, "")}`;

  const operate = useMemo(() => new Map(responses.map((r) => [r.device, r.tOperate_s])), [responses]);
  const statuses = useMemo(() => (chains ? linkStatuses(verdicts, chains.caseId) : new Map<string, VerdictStatus>()), [verdicts, chains]);

  // Follow the shell's selection; keep the current path when the device is on it.
  useEffect(() => {
    setCursor((c) => {
      if (selectedDeviceId) {
        const here = c ? paths[c.path]?.links[c.step]?.device : undefined;
        if (here === selectedDeviceId) return c;
        const found = cursorForDevice(paths, selectedDeviceId, c?.path ?? -1);
        if (found) return found;
      }
      return clampCursor(paths, c);
    });
  }, [paths, selectedDeviceId]);

  const rowId = (p: number, s: number) => `${baseId}-${p}-${s}`;

  useEffect(() => {
    if (!cursor) return;
    const el = document.getElementById(`${baseId}-${cursor.path}-${cursor.step}`);
    el?.scrollIntoView?.({ block: "nearest" });
  }, [cursor, baseId]);

  const go = (next: ChainCursor | null) => {
    if (!next) return;
    const same = cursor !== null && next.path === cursor.path && next.step === cursor.step;
    setCursor(next);
    const device = paths[next.path]?.links[next.step]?.device;
    if (device && !same) onStepChange?.(device);
  };

  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    if (!isChainKey(e.key)) return;
    e.preventDefault();
    go(moveChainCursor(paths, cursor, e.key));
  };

  return (
    <section
      className="ap-pane chain-pane"
      aria-label="Expected isolation and simulated operation"
      // one click anywhere on the pane readies the arrow keys (a row click also selects that step)
      onMouseDown={(e) => {
        if (!(e.target instanceof HTMLElement) || e.target.closest("button, input, select, a")) return;
        requestAnimationFrame(() => bodyRef.current?.focus());
      }}
    >
      <header className="ap-header">
        <h2 className="ap-title">Operation</h2>
        {props.caseLabel ? <span className="ap-subtitle" title={props.caseLabel}>{props.caseLabel}</span> : null}
        <span className="ap-spacer" />
        {paths.length > 0 ? <span className="ap-chip">{paths.length === 1 ? "1 device expected to open" : `${paths.length} devices expected to open`}</span> : null}
      </header>
      {!chains ? (
        <div className="ap-empty">Select a fault case to see its primary and backup devices.</div>
      ) : paths.every((p) => p.links.length === 0) ? (
        <div className="ap-empty">
          No device of the project can separate this fault from its sources.
          {operation ? <OperationSteps operation={operation} nameOf={nameOf} selectedDeviceId={selectedDeviceId} onSelect={(d) => onStepChange?.(d)} /> : null}
        </div>
      ) : (
        <div
          className="chain-body"
          ref={bodyRef}
          tabIndex={0}
          role="grid"
          aria-label="Chain steps: Up and Down step along a path, Left and Right change path"
          aria-activedescendant={cursor ? rowId(cursor.path, cursor.step) : undefined}
          onKeyDown={onKeyDown}
        >
          <table className="chain-table">
            <thead>
              <tr>
                <th>Device</th>
                <th>Role</th>
                <th className="num" title="Current through the device, primary A">Current</th>
                <th className="num" title="Operating time: relay or trip-unit time, fuse melting time">Trip</th>
                <th className="num" title="Clearing time: trip plus breaker or mechanism time, fuse total clearing">Clear</th>
                <th className="num" title="A backup's margin over the primary: its fastest clearing minus the primary's slowest clearing, at the first state's currents">
                  Margin
                </th>
              </tr>
            </thead>
            {paths.map((path, pi) => (
              <tbody key={`${path.source}-${pi}`}>
                <tr className={`chain-group-row${cursor?.path === pi ? " is-active" : ""}`}>
                  <td colSpan={6}>
                    Expected to open {path.links[0] ? path.links[0].deviceName || path.links[0].device : ""}
                    {path.source ? (
                      <>
                        {" "}
                        to separate {path.sourceName || path.source} <span className="verdict-group-counts">{KIND_LABEL[path.sourceKind] ?? path.sourceKind}</span>
                      </>
                    ) : null}
                  </td>
                </tr>
                {path.links.length === 0 ? (
                  <tr>
                    <td colSpan={6} className="ap-empty">
                      no device
                    </td>
                  </tr>
                ) : null}
                {path.links.map((link, si) => {
                  const isCurrent = cursor?.path === pi && cursor.step === si;
                  const status = statuses.get(link.device);
                  return (
                    <tr
                      key={`${link.device}-${si}`}
                      id={rowId(pi, si)}
                      role="row"
                      aria-selected={isCurrent}
                      className={`chain-step${isCurrent ? " is-current" : ""}`}
                      onClick={() => {
                        bodyRef.current?.focus();
                        go({ path: pi, step: si });
                      }}
                    >
                      <td>
                        <span className={`ap-status-dot${status ? ` is-${status}` : ""}`} title={status ? STATUS_LABEL[status] : "no verdict"} />
                        <span className="chain-indent" style={{ width: `${0.4 + link.depth * 1.1}em` }}>
                          {link.depth > 0 ? "↳" : ""}
                        </span>
                        {link.deviceName || link.device}
                      </td>
                      <td>
                        <span className={`chain-role is-${link.role}`}>{link.depth === 0 ? "primary" : "backup"}</span>
                      </td>
                      <td className="num">{formatCurrent_A(link.current_A)}</td>
                      <td className="num">{operate.has(link.device) ? formatTime_s(operate.get(link.device)) : "—"}</td>
                      <td className="num">{link.tClear_s === null ? <span className="chain-no-op">no trip</span> : formatTime_s(link.tClear_s)}</td>
                      <td className={`num${link.marginToNext_s !== null && link.marginToNext_s < 0 ? " chain-negative" : ""}`}>{formatTime_s(link.marginToNext_s)}</td>
                    </tr>
                  );
                })}
              </tbody>
            ))}
          </table>
          {operation ? <OperationSteps operation={operation} nameOf={nameOf} selectedDeviceId={selectedDeviceId} onSelect={(d) => onStepChange?.(d)} /> : null}
        </div>
      )}
      <div className="chain-hint" title="The coloured dot is the worst verdict naming the device in this case">
        ↑↓ to its backups · ←→ between expected devices · dot: worst verdict
      </div>
    </section>
  );
}
