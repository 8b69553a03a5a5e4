// Every element id is unique in the project, every scenario id among scenarios,
// and every function id within its relay (ids are how records refer to each other).
import { errorMessage, type Message } from "../messages.ts";
import type { RuleContext } from "./ruleContext.ts";

export function uniqueIds(ctx: RuleContext): Message[] {
  const out: Message[] = [];
  const seen = new Map<string, number>();
  ctx.project.elements.forEach((e, i) => {
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
