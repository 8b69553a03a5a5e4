// Every key the study builds from ids, in one place: case ids, matrix rows, location keys, verdict ids
// and the keys of opened sets. Ids are joined with "|" (and ">" within a pair); the parsers read back what
// the builders wrote. Study code never joins ids into keys by hand.
import type { FaultLimit, FaultLocation, FaultType } from "./types.ts";
import type { OpenEnd } from "./studySolver.ts";

export function locationKey(loc: FaultLocation): string {
  return loc.kind === "bus" ? `bus:${loc.bus}` : `line:${loc.line}@${loc.pct}`;
}

/** The location a locationKey names; null when the text is not one. */
export function parseLocationKey(key: string): FaultLocation | null {
  if (key.startsWith("bus:")) return { kind: "bus", bus: key.slice(4) };
  const m = /^line:(.*)@(-?[0-9.]+)$/.exec(key);
  return m ? { kind: "line", line: m[1], pct: Number(m[2]) } : null;
}

export function caseId(scenario: string, loc: FaultLocation, faultType: FaultType, limit: FaultLimit): string {
  return `${scenario}|${locationKey(loc)}|${faultType}|${limit}`;
}

/** The parts of a case id; null when the text is not one. Scenario ids may not hold "|" for this to be exact. */
export function parseCaseId(id: string): { scenario: string; location: FaultLocation; faultType: FaultType; limit: FaultLimit } | null {
  const parts = id.split("|");
  if (parts.length < 4) return null;
  const limit = parts[parts.length - 1];
  const faultType = parts[parts.length - 2];
  const location = parseLocationKey(parts.slice(1, parts.length - 2).join("|"));
  if (!location || (limit !== "max" && limit !== "min") || !["3ph", "LL", "LG", "LLG"].includes(faultType)) return null;
  return { scenario: parts[0], location, faultType: faultType as FaultType, limit };
}

/** The case id without its scenario: the row of the study matrix. */
export function caseRowId(c: { location: FaultLocation; faultType: FaultType; limit: FaultLimit }): string {
  return `${locationKey(c.location)}|${c.faultType}|${c.limit}`;
}

/** A verdict about one device (or a pair `device>other`) in one case, or in one scenario when caseId is null. */
export function verdictId(kind: string, device: string, other: string | null, scope: string): string {
  return `${kind}|${other === null ? device : `${device}>${other}`}|${scope}`;
}

/** One key for a set of opened element ends, whatever order they opened in. */
export function openSetKey(open: readonly OpenEnd[]): string {
  return open
    .map((o) => `${o.element}|${o.end}`)
    .sort()
    .join(",");
}
