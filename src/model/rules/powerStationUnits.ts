// A generator's power station unit (IEC 60909-0:2016, 6.7) names a real unit transformer: it exists, is a
// transformer, serves no other generator, and its LV bus is the generator's bus (or joined to it by switches, such
// as a generator breaker). What a scenario switches in or out, and whether the LV side feeds anything but
// auxiliaries, the engine checks per scenario when it compiles.
import { errorMessage, type Message } from "../messages.ts";
import type { Generator } from "../schema.ts";
import { kindWord, type RuleContext } from "./ruleContext.ts";

export function powerStationUnits(ctx: RuleContext): Message[] {
  const out: Message[] = [];
  const gens = ctx.project.elements.filter((e): e is Generator => e.kind === "generator" && e.unit !== undefined);
  if (gens.length === 0) return out;
  const sameBus = switchGroups(ctx);
  const claimedBy = new Map<string, Generator>();
  for (const g of gens) {
    const ref = g.unit!.transformer;
    const field = "unit.transformer";
    const tr = ctx.byId.get(ref);
    if (!tr) {
      out.push(errorMessage(`${ctx.label(g)}: ${field} "${ref}" names no element in the project (dangling reference)`, g.id, field));
      continue;
    }
    if (tr.kind !== "transformer") {
      out.push(errorMessage(`${ctx.label(g)}: ${field} "${ref}" names ${kindWord(tr)}, not a transformer`, g.id, field));
      continue;
    }
    const first = claimedBy.get(tr.id);
    if (first) {
      out.push(errorMessage(`${ctx.label(g)}: ${field} "${ref}" is already the unit transformer of ${ctx.label(first)}; a power station unit has one generator`, g.id, field));
      continue;
    }
    claimedBy.set(tr.id, g);
    if (sameBus(g.bus) !== sameBus(tr.lvBus)) {
      const side = sameBus(g.bus) === sameBus(tr.hvBus) ? `the generator is on its HV bus "${tr.hvBus}"` : `its LV bus is "${tr.lvBus}"`;
      out.push(errorMessage(`${ctx.label(g)}: ${field} "${ref}" does not step up from the generator's bus "${g.bus}": ${side}`, g.id, field));
    }
  }
  return out;
}

/** Representative bus of each group of buses joined by switches (open or closed: a unit's breaker may be open). */
function switchGroups(ctx: RuleContext): (bus: string) => string {
  const parent = new Map<string, string>();
  const root = (b: string): string => {
    let r = b;
    while (parent.has(r) && parent.get(r) !== r) r = parent.get(r)!;
    return r;
  };
  for (const e of ctx.project.elements) {
    if (e.kind !== "switch") continue;
    const a = root(e.busA);
    const b = root(e.busB);
    if (a !== b) parent.set(a, b);
  }
  return root;
}
