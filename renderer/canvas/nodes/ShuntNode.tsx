// A one-terminal element (grid feeder, generator, inverter, motor, load). Drawn below its bus with
// the terminal on top, or above it with the terminal at the bottom.
import { memo } from "react";
import { Handle, Position, type NodeProps } from "@xyflow/react";
import type { ShuntFlowNode } from "../flowTypes.ts";
import { ElementSymbol, SHUNT_BOX } from "../symbols/ElementSymbol.tsx";
import { DeviceStack } from "./DeviceStack.tsx";
import { FlowArrow } from "./FlowArrow.tsx";
import { isOpen } from "./openTerminal.ts";

function ShuntNodeView({ data, selected }: NodeProps<ShuntFlowNode>) {
  const { element, colorA, devicesA, caption, detail, flow, marks, selectedDevices, down } = data;
  const { w, h } = SHUNT_BOX;
  return (
    <div className={`element-node${selected ? " is-selected" : ""}`} style={{ width: w, height: h }} data-element={element.id}>
      <svg className="element-svg" width={w} height={h} viewBox={`0 0 ${w} ${h}`}>
        <ElementSymbol element={element} colorA={colorA} colorB={colorA} down={down} />
        <DeviceStack devices={devicesA} y={down ? h - 12 : 12} strokeX={w / 2} selected={selectedDevices} marks={marks} />
        {flow && <FlowArrow flow={flow} x={w / 2 + 8} y={down ? h - 14 : 14} id={element.id} aBelow={down} />}
      </svg>
      <div className="element-caption">
        <span className="caption-name">{caption}</span>
        <span className="caption-detail">{detail}</span>
      </div>
      <Handle id="a" type="source" position={down ? Position.Bottom : Position.Top} className={`terminal-handle${isOpen(element, "a") ? " is-open" : ""}`} title={isOpen(element, "a") ? "Not connected: drag to a bus" : undefined} />
    </div>
  );
}

export const ShuntNode = memo(ShuntNodeView);
