// A bus: a thick horizontal bar that takes any number of connections along its length.
import { memo } from "react";
import { Handle, Position, type NodeProps } from "@xyflow/react";
import type { BusFlowNode } from "../flowTypes.ts";
import { fmt } from "./formatting.ts";

export const BUS_HEIGHT = 44;
export const BUS_BAR_Y = 22;

function BusNodeView({ data, selected }: NodeProps<BusFlowNode>) {
  const { bus, color, width, faulted, ikss_kA, voltage_pu } = data;
  return (
    <div className={`bus-node${selected ? " is-selected" : ""}${faulted ? " is-faulted" : ""}`} style={{ width, height: BUS_HEIGHT }} data-element={bus.id}>
      <div className="bus-label">
        <span className="bus-name">{bus.name || bus.id}</span>
        <span className="bus-kv">{fmt(bus.un_kV)} kV</span>
      </div>
      <div className="bus-bar" style={{ top: BUS_BAR_Y - 3, background: color }} />
      <Handle id="bus" type="source" position={Position.Top} className="bus-handle" style={{ top: BUS_BAR_Y - 4 }} isConnectableStart={false} />
      {voltage_pu !== null && (
        <span className="bus-voltage overlay-label" data-testid={`voltage-${bus.id}`}>
          {fmt(voltage_pu * 100, 3)} % U
        </span>
      )}
      {faulted && ikss_kA !== null && (
        <span className="fault-badge" data-testid="fault-ikss">
          <svg width="14" height="14" viewBox="0 0 14 14" aria-hidden>
            <path d="M8 0 L2 8 L6 8 L4 14 L12 5 L8 5 Z" />
          </svg>
          I&quot;k {fmt(ikss_kA, 4)} kA
        </span>
      )}
    </div>
  );
}

export const BusNode = memo(BusNodeView);
