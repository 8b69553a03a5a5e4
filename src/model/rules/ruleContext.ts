// What every validation rule gets: the project and quick look-ups by id, built once.
import type { Element, Project } from "../schema.ts";
import { elementLabel } from "../elementLabel.ts";

export interface RuleContext {
  project: Project;
  /** First element with each id (duplicates are reported by the ids rule). */
  byId: Map<string, Element>;
  label(e: { kind?: unknown; id?: unknown; name?: unknown; construction?: unknown }): string;
}

export function ruleContext(project: Project): RuleContext {
  const byId = new Map<string, Element>();
  for (const e of project.elements) if (!byId.has(e.id)) byId.set(e.id, e);
  return { project, byId, label: (e) => elementLabel(e) };
}

/** How a reference is described when it points at the wrong thing. */
export function kindWord(e: Element): string {
  return e.kind === "lvbreaker" ? "an LV breaker" : /^[aeiou]/.test(e.kind) ? `an ${e.kind}` : `a ${e.kind}`;
}

/** Relative difference |a-b|/b, for the 10 % voltage rules. */
export function relativeDiff(a: number, b: number): number {
  return Math.abs(a - b) / b;
}

export function fmt(x: number): string {
  return String(Number(x.toPrecision(6)));
}
