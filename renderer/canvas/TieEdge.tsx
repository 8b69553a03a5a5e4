// The tie from an element's terminal to its bus: it lands on the bar straight below or above the
// terminal when the bar reaches that far, else it runs across at half height to the bar's nearest end.
import { memo } from "react";
import { BaseEdge, useInternalNode, type EdgeProps } from "@xyflow/react";
import type { OneLineEdge } from "./flowTypes.ts";
import { BUS_BAR_Y } from "./nodes/BusNode.tsx";

function TieEdgeView({ sourceX, sourceY, target, data, id }: EdgeProps<OneLineEdge>) {
  const bus = useInternalNode(target);
  if (!bus) return null;
  const bx = bus.internals.positionAbsolute.x;
  const bw = bus.measured.width ?? bus.width ?? 200;
  const by = bus.internals.positionAbsolute.y + BUS_BAR_Y;
  const px = Math.min(Math.max(sourceX, bx + 4), bx + bw - 4);
  const midY = (sourceY + by) / 2;
  const path = px === sourceX ? `M ${sourceX} ${sourceY} L ${px} ${by}` : `M ${sourceX} ${sourceY} L ${sourceX} ${midY} L ${px} ${midY} L ${px} ${by}`;
  return <BaseEdge id={id} path={path} style={{ stroke: data?.color ?? "var(--tone-none)", strokeWidth: 2 }} />;
}

export const TieEdge = memo(TieEdgeView);
