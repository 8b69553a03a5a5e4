// Ratings agree with the network: a transformer's rated voltages and a machine's or inverter's rated voltage
// lie within 10 % of the nominal voltage of the bus they connect to; a line or switch joins buses of one voltage.
import { errorMessage, type Message } from "../messages.ts";
import type { Element } from "../schema.ts";
import { fmt, relativeDiff, type RuleContext } from "./ruleContext.ts";

/** Rated vs nominal voltage tolerance. */
export const RATED_KV_TOLERANCE = 0.1; // common practice: equipment ratings within +/-10 % of the system voltage

export function voltages(ctx: RuleContext): Message[] {
  const out: Message[] = [];
  const un = (busId: string): number | undefined => {
    const b = ctx.byId.get(busId);
    return b?.kind === "bus" ? b.un_kV : undefined;
  };
  const rated = (e: Element, field: string, ur: number, busField: string, busId: string) => {
    const u = un(busId);
    if (u === undefined || relativeDiff(ur, u) <= RATED_KV_TOLERANCE + 1e-12) return;
    out.push(
      errorMessage(
        `${ctx.label(e)}: ${field} ${fmt(ur)} kV differs from the nominal ${fmt(u)} kV of ${busField} "${busId}" by ${fmt(relativeDiff(ur, u) * 100)} % (more than 10 %)`,
        e.id,
        field,
      ),
    );
  };
  for (const e of ctx.project.elements) {
    switch (e.kind) {
      case "transformer":
        rated(e, "urHv_kV", e.urHv_kV, "hvBus", e.hvBus);
        rated(e, "urLv_kV", e.urLv_kV, "lvBus", e.lvBus);
        break;
      case "generator":
      case "inverter":
      case "motor":
        rated(e, "ur_kV", e.ur_kV, "bus", e.bus);
        break;
      case "line":
      case "switch": {
        const [a, b, fa, fb] = e.kind === "line" ? [e.fromBus, e.toBus, "fromBus", "toBus"] : [e.busA, e.busB, "busA", "busB"];
        const ua = un(a);
        const ub = un(b);
        if (ua !== undefined && ub !== undefined && relativeDiff(ub, ua) > 1e-9) {
          out.push(
            errorMessage(
              `${ctx.label(e)}: ${fb} "${b}" is at ${fmt(ub)} kV but ${fa} "${a}" is at ${fmt(ua)} kV; a ${e.kind === "line" ? "line" : "switch"} joins buses of one nominal voltage`,
              e.id,
              fb,
            ),
          );
        }
        break;
      }
      default:
        break;
    }
  }
  return out;
}
