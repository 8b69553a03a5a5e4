// Every reference names something that exists and is of the right kind: bus fields name buses,
// a protective device sits at a branch end (from/to) or at a shunt element's terminal,
// criteria pairs name protective devices.
import { errorMessage, type Message } from "../messages.ts";
import { isProtectiveDevice, type Element } from "../schema.ts";
import { kindWord, type RuleContext } from "./ruleContext.ts";

const BUS_FIELDS = ["bus", "hvBus", "lvBus", "fromBus", "toBus", "busA", "busB"] as const;
const SHUNT_KINDS = new Set(["grid", "generator", "inverter", "motor", "load"]);

export function references(ctx: RuleContext): Message[] {
  const out: Message[] = [];
  for (const e of ctx.project.elements) {
    const record = e as unknown as Record<string, unknown>;
    for (const field of BUS_FIELDS) {
      if (e.kind === "bus" || typeof record[field] !== "string") continue;
      const ref = record[field] as string;
      const target = ctx.byId.get(ref);
      if (!target) out.push(errorMessage(`${ctx.label(e)}: ${field} "${ref}" names no element in the project (dangling reference)`, e.id, field));
      else if (target.kind !== "bus") out.push(errorMessage(`${ctx.label(e)}: ${field} "${ref}" names ${kindWord(target)}, not a bus`, e.id, field));
    }
    const pair = twoBuses(e);
    if (pair && pair[0] === pair[1]) out.push(errorMessage(`${ctx.label(e)}: both ends are on bus "${pair[0]}"; a ${e.kind} must join two different buses`, e.id, pair[2]));
    if (isProtectiveDevice(e)) out.push(...deviceLocation(ctx, e));
  }
  ctx.project.criteria.pairCti.forEach((p, k) => {
    for (const role of ["primary", "backup"] as const) {
      const target = ctx.byId.get(p[role]);
      const field = `pairCti.${k}.${role}`;
      if (!target) out.push(errorMessage(`Criteria (criteria): ${field} "${p[role]}" names no element in the project`, undefined, field));
      else if (!isProtectiveDevice(target)) out.push(errorMessage(`Criteria (criteria): ${field} "${p[role]}" names ${kindWord(target)}, not a protective device`, undefined, field));
    }
  });
  return out;
}

function twoBuses(e: Element): [string, string, string] | null {
  if (e.kind === "transformer") return [e.hvBus, e.lvBus, "lvBus"];
  if (e.kind === "line") return [e.fromBus, e.toBus, "toBus"];
  if (e.kind === "switch") return [e.busA, e.busB, "busB"];
  return null;
}

function deviceLocation(ctx: RuleContext, device: Element & { at: { element: string; end: string } }): Message[] {
  const { element, end } = device.at;
  const target = ctx.byId.get(element);
  const label = ctx.label(device);
  if (!target) return [errorMessage(`${label}: at.element "${element}" names no element in the project (dangling reference)`, device.id, "at.element")];
  if (target.kind === "transformer" || target.kind === "line") {
    if (end === "terminal") return [errorMessage(`${label}: at.end must be "from" or "to" for ${kindWord(target)} (${ctx.label(target)}), got "terminal"`, device.id, "at.end")];
    return [];
  }
  if (target.kind === "switch") {
    if (target.device !== "breaker")
      return [errorMessage(`${label}: at.element "${element}" is a ${target.device === "switch" ? "load switch" : "disconnector"} (${ctx.label(target)}), which cannot interrupt a fault; only a breaker-type switch can carry a protective device`, device.id, "at.element")];
    if (end === "terminal") return [errorMessage(`${label}: at.end must be "from" (at busA, looking towards busB) or "to" (at busB, looking towards busA) for a switch (${ctx.label(target)}), got "terminal"`, device.id, "at.end")];
    return [];
  }
  if (SHUNT_KINDS.has(target.kind)) {
    if (end !== "terminal") return [errorMessage(`${label}: at.end must be "terminal" for ${kindWord(target)} (${ctx.label(target)}), got "${end}"`, device.id, "at.end")];
    return [];
  }
  return [errorMessage(`${label}: at.element "${element}" names ${kindWord(target)}; a protective device sits at a branch end or a shunt element's terminal`, device.id, "at.element")];
}
