// A two-terminal element (transformer, line or cable, switch): terminal a (from / HV / A side) on
// top and b below, or a on the left and b on the right when drawn across; devices at each end and
// the fault current arrow after a fault.
import { memo } from "react";
import { Handle, Position, type NodeProps } from "@xyflow/react";
import type { BranchFlowNode } from "../flowTypes.ts";
import { ElementSymbol, BRANCH_BOX } from "../symbols/ElementSymbol.tsx";
import { DeviceStack } from "./DeviceStack.tsx";
import { FlowArrow } from "./FlowArrow.tsx";
import { fmt } from "./formatting.ts";
import { isOpen } from "./openTerminal.ts";

function BranchNodeView({ data, selected }: NodeProps<BranchFlowNode>) {
  const { element, colorA, colorB, devicesA, devicesB, caption, detail, flow, marks, selectedDevices, horizontal, faulted, ikss_kA } = data;
  const { w, h } = BRANCH_BOX;
  const box = horizontal ? { w: h, h: w } : { w, h };
  // drawn upright, then turned a quarter for the across form: (x, y) -> (y, w - x)
  const turn = horizontal ? `matrix(0 -1 1 0 0 ${w})` : undefined;
  return (
    <div className={`element-node is-branch${horizontal ? " is-across" : ""}${selected ? " is-selected" : ""}`} style={{ width: box.w, height: box.h }} data-element={element.id}>
      <svg className="element-svg" width={box.w} height={box.h} viewBox={`0 0 ${box.w} ${box.h}`}>
        <g transform={turn}>
          <ElementSymbol element={element} colorA={colorA} colorB={colorB} />
          <DeviceStack devices={devicesA} y={16} strokeX={w / 2} selected={selectedDevices} marks={marks} />
          <DeviceStack devices={devicesB} y={h - 16} strokeX={w / 2} selected={selectedDevices} marks={marks} />
        </g>
        {flow &&
          (horizontal ? (
            <FlowArrow flow={flow} x={box.w / 2} y={box.h / 2 - 12} id={element.id} across />
          ) : (
            // a cable's value in its lower half, clear of the names beside the upper half (its own and a
            // neighbour's); a transformer's by its windings, clear of the devices at its ends
            <FlowArrow flow={flow} x={w / 2 - 10} y={element.kind === "line" ? h * 0.7 : h / 2} id={element.id} textLeft />
          ))}
      </svg>
      <div className="element-caption">
        <span className="caption-name">{caption}</span>
        <span className="caption-detail">{detail}</span>
      </div>
      {faulted && ikss_kA !== null && (
        <span className="fault-badge on-line" data-testid="fault-ikss">
          ⚡ I&quot;k {fmt(ikss_kA, 4)} kA
        </span>
      )}
      <Handle id="a" type="source" position={horizontal ? Position.Left : Position.Top} className={`terminal-handle${isOpen(element, "a") ? " is-open" : ""}`} title={isOpen(element, "a") ? "Not connected: drag to a bus" : undefined} />
      <Handle id="b" type="source" position={horizontal ? Position.Right : Position.Bottom} className={`terminal-handle${isOpen(element, "b") ? " is-open" : ""}`} title={isOpen(element, "b") ? "Not connected: drag to a bus" : undefined} />
    </div>
  );
}

export const BranchNode = memo(BranchNodeView);
