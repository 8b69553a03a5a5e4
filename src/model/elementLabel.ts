// How messages name an element: its kind in words, its id and, when it has one, its name in quotes,
// e.g. `Cable C12 "Dock feeder"`.

const KIND_WORDS: Record<string, string> = {
  bus: "Bus",
  grid: "Grid feeder",
  transformer: "Transformer",
  generator: "Generator",
  inverter: "Inverter",
  motor: "Motor",
  load: "Load",
  switch: "Switch",
  relay: "Relay",
  fuse: "Fuse",
  lvbreaker: "LV breaker",
  scenario: "Scenario",
};

interface Labelled {
  kind?: unknown;
  id?: unknown;
  name?: unknown;
  construction?: unknown;
}

/** `Cable C12 "Dock feeder"`; tolerant of half-broken records (used on raw input too). */
export function elementLabel(record: Labelled | null | undefined, fallback = "Element"): string {
  const r = record ?? {};
  let word = typeof r.kind === "string" ? ((Object.hasOwn(KIND_WORDS, r.kind) ? KIND_WORDS[r.kind] : undefined) ?? `Element of kind ${JSON.stringify(r.kind)}`) : fallback;
  if (r.kind === "line") word = r.construction === "overhead" ? "Overhead line" : "Cable";
  const id = typeof r.id === "string" && r.id !== "" ? idText(r.id) : "(no id)";
  const name = typeof r.name === "string" && r.name !== "" ? ` "${r.name}"` : "";
  return `${word} ${id}${name}`;
}

/** An id as it appears in messages: bare when plain, quoted when it has spaces, quotes or control characters. */
export function idText(id: string): string {
  for (let k = 0; k < id.length; k++) {
    const c = id.charCodeAt(k);
    if (c <= 0x20 || c === 0x22 || c === 0x5c || c === 0x7f || /\s/.test(id[k])) return JSON.stringify(id);
  }
  return id;
}
