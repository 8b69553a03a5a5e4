// Every element id is unique in the project, every scenario id among scenarios,
// and every function id within its relay (ids are how records refer to each other). An element id is
// never "__proto__".
import { errorMessage, type Message } from "../messages.ts";
import type { RuleContext } from "./ruleContext.ts";

export function uniqueIds(ctx: RuleContext): Message[] {
  const out: Message[] = [];
  const seen = new Map<string, number>();
  ctx.project.elements.forEach((e, i) => {
    // Element ids are keys of layout and switchStates, where JSON readers give "__proto__" a meaning of its own
    if (e.id === "__proto__") out.push(errorMessage(`${ctx.label(e)}: id "__proto__" is reserved (as a key of layout and switchStates it would not be kept); choose another id`, e.id, "id"));
    const first = seen.get(e.id);
    if (first === undefined) seen.set(e.id, i);
    else out.push(errorMessage(`${ctx.label(e)}: id "${e.id}" is already used by elements[${first}] (ids must be unique; this is elements[${i}])`, e.id, "id"));
  });
  const scenarioSeen = new Set<string>();
  for (const s of ctx.project.scenarios) {
    if (scenarioSeen.has(s.id)) out.push(errorMessage(`${ctx.label({ ...s, kind: "scenario" })}: id "${s.id}" is used by more than one scenario`, s.id, "id"));
    scenarioSeen.add(s.id);
  }
  for (const e of ctx.project.elements) {
    if (e.kind !== "relay") continue;
    const fnSeen = new Set<string>();
    e.functions.forEach((f, k) => {
      if (fnSeen.has(f.id)) out.push(errorMessage(`${ctx.label(e)}: functions.${k}.id "${f.id}" is used by another function of this relay`, e.id, `functions.${k}.id`));
      fnSeen.add(f.id);
    });
  }
  return out;
}
