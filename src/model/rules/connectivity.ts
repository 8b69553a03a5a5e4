// Topology checks: an element connected to nothing, a network with no source, and, per scenario,
// a part of the network (an island of buses joined by in-service branches and closed switches) with no source.
import { warningMessage, type Message } from "../messages.ts";
import { elementBuses, isSource } from "../schema.ts";
import { findIslands } from "../topology.ts";
import type { RuleContext } from "./ruleContext.ts";

/** At most this many buses are named in one island message; the rest are counted. */
const NAMED_BUSES = 6;

export function connectivity(ctx: RuleContext): Message[] {
  const out: Message[] = [];
  const { project } = ctx;
  const attached = new Map<string, number>();
  for (const e of project.elements) {
    if (e.kind === "bus") continue;
    for (const b of elementBuses(e)) attached.set(b, (attached.get(b) ?? 0) + 1);
  }
  for (const e of project.elements) {
    if (e.kind === "bus" && !attached.has(e.id)) out.push(warningMessage(`${ctx.label(e)}: connected to nothing (no branch, switch, source or load uses this bus)`, e.id));
  }
  const buses = project.elements.filter((e) => e.kind === "bus");
  if (buses.length > 0 && !project.elements.some(isSource)) {
    out.push(warningMessage("Project file: elements has no source (grid feeder, generator or inverter); no fault current can flow", undefined, "elements"));
    return out;
  }
  for (const s of project.scenarios) {
    const label = ctx.label({ ...s, kind: "scenario" });
    for (const island of findIslands(project, s)) {
      // a bus connected to nothing is reported once above, not again per scenario
      if (island.sources.length > 0 || island.buses.every((b) => !attached.has(b))) continue;
      const named = island.buses.slice(0, NAMED_BUSES).map((b) => ctx.label(ctx.byId.get(b) ?? { id: b }).replace(/^Bus /, ""));
      const more = island.buses.length > NAMED_BUSES ? ` and ${island.buses.length - NAMED_BUSES} more` : "";
      const [noun, verb] = island.buses.length === 1 ? ["bus", "forms"] : ["buses", "form"];
      out.push(
        warningMessage(
          `${label}: ${noun} ${named.join(", ")}${more} ${verb} a part of the network with no source in service (dead in this scenario; see outOfService and switchStates)`,
          s.id,
          "outOfService",
        ),
      );
    }
  }
  return out;
}
