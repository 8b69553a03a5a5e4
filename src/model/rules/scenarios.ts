// Scenarios refer only to what exists: out-of-service ids name elements, switch overrides name switches;
// the layout names elements. A project needs at least one scenario to be studied.
import { errorMessage, warningMessage, type Message } from "../messages.ts";
import { kindWord, type RuleContext } from "./ruleContext.ts";
import { idText } from "../elementLabel.ts";

export function scenarios(ctx: RuleContext): Message[] {
  const out: Message[] = [];
  if (ctx.project.scenarios.length === 0 && ctx.project.elements.length > 0) {
    out.push(warningMessage("Project file: scenarios is empty; add at least one scenario to run a study", undefined, "scenarios"));
  }
  for (const s of ctx.project.scenarios) {
    const label = ctx.label({ ...s, kind: "scenario" });
    s.outOfService.forEach((ref, k) => {
      if (!ctx.byId.has(ref)) out.push(errorMessage(`${label}: outOfService.${k} "${ref}" names no element in the project (dangling reference)`, s.id, `outOfService.${k}`));
    });
    for (const ref of Object.keys(s.switchStates)) {
      const target = ctx.byId.get(ref);
      if (!target) out.push(errorMessage(`${label}: switchStates.${ref} names no element in the project (dangling reference)`, s.id, `switchStates.${ref}`));
      else if (target.kind !== "switch") out.push(errorMessage(`${label}: switchStates.${ref} names ${kindWord(target)}, not a switch`, s.id, `switchStates.${ref}`));
    }
  }
  for (const key of Object.keys(ctx.project.layout)) {
    if (!ctx.byId.has(key)) out.push(warningMessage(`Layout of ${idText(key)}: names no element in the project (a left-over position; it is kept but unused)`, key, `layout.${key}`));
  }
  return out;
}
