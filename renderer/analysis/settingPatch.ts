// A setting dragged on the time-current plot, as document changes on the device.
import type { ProtectiveDevice } from "../../src/model/schema.ts";
import type { DocChange } from "../store/changes.ts";
import type { TccSettingPatch } from "../panes/tcc/index.ts";

export function settingPatchChanges(device: ProtectiveDevice, functionId: string, patch: TccSettingPatch): DocChange[] {
  const out: DocChange[] = [];
  switch (device.kind) {
    case "relay": {
      const i = device.functions.findIndex((f) => f.id === functionId);
      if (i < 0) return out;
      if (patch.pickup_A !== undefined) out.push({ type: "setField", id: device.id, path: ["functions", i, "pickup_A"], value: patch.pickup_A });
      if (patch.multiplier !== undefined) out.push({ type: "setField", id: device.id, path: ["functions", i, "multiplier"], value: patch.multiplier });
      return out;
    }
    case "fuse":
      if (patch.pickup_A !== undefined) out.push({ type: "setField", id: device.id, path: ["rating_A"], value: patch.pickup_A });
      return out;
    case "lvbreaker":
      // the schema bounds Ir to 0.4-1 x In
      if (patch.pickup_A !== undefined) out.push({ type: "setField", id: device.id, path: ["longTime", "ir_x"], value: Math.min(1, Math.max(0.4, patch.pickup_A / device.in_A)) });
      return out;
  }
}
