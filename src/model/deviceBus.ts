// The bus a protective device sits at: the bus at its branch end, or the bus of the shunt element it looks into.
import type { Element, ProtectiveDevice, Project } from "./schema.ts";

export function deviceBus(device: ProtectiveDevice, byId: ReadonlyMap<string, Element>): string | null {
  const host = byId.get(device.at.element);
  if (!host) return null;
  switch (host.kind) {
    case "transformer":
      return device.at.end === "to" ? host.lvBus : host.hvBus;
    case "line":
      return device.at.end === "to" ? host.toBus : host.fromBus;
    case "switch":
      return device.at.end === "to" ? host.busB : host.busA;
    case "bus":
    case "relay":
    case "fuse":
    case "lvbreaker":
      return null;
    default:
      return host.bus;
  }
}

/** Nominal kV of the bus a device sits at; null when it cannot be placed. */
export function deviceKv(device: ProtectiveDevice, project: Project, byId: ReadonlyMap<string, Element> = new Map(project.elements.map((e) => [e.id, e]))): number | null {
  const busId = deviceBus(device, byId);
  const bus = busId ? byId.get(busId) : undefined;
  return bus?.kind === "bus" ? bus.un_kV : null;
}
