// Data carried by the one-line's nodes and edges (built by toFlow from the document).
import type { Node, Edge } from "@xyflow/react";
import type { Element, ProtectiveDevice, Bus } from "../../src/model/schema.ts";
import type { BranchFlow, DeviceMark } from "../fault/overlayTypes.ts";

export type BusNodeData = {
  bus: Bus;
  color: string;
  width: number;
  faulted: boolean;
  ikss_kA: number | null;
  voltage_pu: number | null;
};

export type ElementNodeData = {
  element: Element;
  colorA: string;
  colorB: string;
  devicesA: ProtectiveDevice[];
  devicesB: ProtectiveDevice[];
  selectedDevices: string[];
  caption: string;
  detail: string;
  flow: BranchFlow | null;
  marks: Record<string, DeviceMark>;
  faulted: boolean;
  ikss_kA: number | null;
  /** Shunts: the element sits above its bus, so its terminal is at the bottom. */
  down: boolean;
  /** Branches: drawn left to right (terminal a on the left), e.g. a bus coupler between two bus sections. */
  horizontal: boolean;
};

export type TieEdgeData = { color: string; busId: string };

export type BusFlowNode = Node<BusNodeData, "bus">;
export type BranchFlowNode = Node<ElementNodeData, "branch">;
export type ShuntFlowNode = Node<ElementNodeData, "shunt">;
export type OneLineNode = BusFlowNode | BranchFlowNode | ShuntFlowNode;
export type OneLineEdge = Edge<TieEdgeData, "tie">;
