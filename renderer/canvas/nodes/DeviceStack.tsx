// The devices at one end of an element, stacked leftward from the connecting stroke,
// each clickable (selects the device) and coloured by its role in the last fault.
import type { MouseEvent } from "react";
import type { ProtectiveDevice } from "../../../src/model/schema.ts";
import type { DeviceMark } from "../../fault/overlayTypes.ts";
import { DeviceMarker, MARKER_W } from "../symbols/DeviceMarker.tsx";
import { useSessionStore } from "../../store/sessionStore.ts";
import { fmtTime } from "./formatting.ts";

interface Props {
  devices: ProtectiveDevice[];
  y: number;
  strokeX: number;
  selected: string[];
  marks: Record<string, DeviceMark>;
}

function selectDevice(e: MouseEvent, id: string) {
  e.stopPropagation();
  const s = useSessionStore.getState();
  const additive = e.shiftKey || e.ctrlKey || e.metaKey;
  s.set({ selection: additive ? Array.from(new Set([...s.selection, id])) : [id] });
}

export function DeviceStack({ devices, y, strokeX, selected, marks }: Props) {
  return (
    <>
      {devices.map((d, i) => {
        const x = strokeX - 14 - (i + 1) * (MARKER_W + 4);
        const mark = marks[d.id];
        const cls = ["device", `device-${d.kind}`, mark ? `role-${mark.role}` : "", selected.includes(d.id) ? "is-selected" : ""].join(" ");
        return (
          <g key={d.id} className={cls} onClick={(e) => selectDevice(e, d.id)} data-device={d.id}>
            <title>{`${d.name || d.id} (${d.kind})`}</title>
            <DeviceMarker device={d} x={x} y={y} strokeX={strokeX} />
            {mark && (
              <text x={x + MARKER_W / 2} y={y - 12} textAnchor="middle" className="device-time" data-testid={`time-${d.id}`}>
                {fmtTime(mark.tClear_s)}
              </text>
            )}
          </g>
        );
      })}
    </>
  );
}
