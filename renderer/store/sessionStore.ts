// Session state: what the user is looking at, never saved in the project and never undone.
import { create } from "zustand";
import type { FileRef } from "../../src/model/hostContract.ts";
import type { FaultLimit, FaultType } from "../../src/study/types.ts";
import type { Element } from "../../src/model/schema.ts";
import type { NodePlace } from "./changes.ts";

export type PaneId = "fault" | "chain" | "tcc" | "verdicts" | "modes";
export type Theme = "light" | "dark";

/** A fault the user asked for: at a bus or at a point along a line. */
export type FaultTarget = { kind: "bus"; bus: string } | { kind: "line"; line: string; pct: number };

export interface NoticeAction {
  label: string;
  run(): void;
}

export interface NoticeOptions {
  /** A later notice on the same topic replaces this one (e.g. "study": one study message at a time). */
  topic?: string;
  /** A button in the notice, e.g. Undo after a deletion. */
  action?: NoticeAction;
}

export interface Notice extends NoticeOptions {
  id: number;
  tone: "info" | "error";
  text: string;
  details?: string[];
}

export interface Clipboard {
  elements: Element[];
  places: Record<string, NodePlace>;
}

export interface SessionState {
  selection: string[];
  activeScenarioId: string | null;
  faultType: FaultType;
  faultLimit: FaultLimit;
  faultTarget: FaultTarget | null;
  file: FileRef | null;
  /** Document revision at the last save or open; dirty when it differs. */
  savedRevision: number;
  theme: Theme;
  snapToGrid: boolean;
  pane: PaneId;
  clipboard: Clipboard | null;
  /** Bumped to ask the canvas to fit the whole diagram in view. */
  fitSeq: number;
  /** A device the canvas should bring into view (stepping through a case); seq bumps on every request. */
  follow: { device: string; seq: number } | null;
  notices: Notice[];
  /** Developer figures in the status area (the edit-to-overlay time); off by default, kept per user. */
  diagnostics: boolean;
  /** The one-line's overview map; kept per user. */
  showMiniMap: boolean;
  /** Share of the centre column's height given to each lower pane (splitter); kept per user. */
  bottomFractions: Record<PaneId, number>;
  /** The lower pane enlarged over most of the one-line (e.g. to read the time-current plot). */
  bottomEnlarged: boolean;
  set(partial: Partial<Omit<SessionState, "set" | "notify" | "dismiss" | "dismissTopic">>): void;
  notify(tone: Notice["tone"], text: string, details?: string[], options?: NoticeOptions): void;
  dismiss(id: number): void;
  /** Removes the notices on a topic (a study error once another project is open). */
  dismissTopic(topic: string): void;
}

const FRACTION_KEY = "islet.bottomFractions";
export const BOTTOM_FRACTION = { min: 0.15, max: 0.8 } as const;
/** Each pane starts with the height it needs: the fault figures little, the plot and the matrix more. */
export const BOTTOM_START: Record<PaneId, number> = { fault: 0.26, modes: 0.26, chain: 0.36, tcc: 0.45, verdicts: 0.45 };

let noticeSeq = 0;

export const useSessionStore = create<SessionState>()((set) => ({
  selection: [],
  follow: null,
  activeScenarioId: null,
  faultType: "3ph",
  faultLimit: "max",
  faultTarget: null,
  file: null,
  savedRevision: 0,
  theme: "light",
  snapToGrid: true,
  pane: "fault",
  clipboard: null,
  fitSeq: 0,
  notices: [],
  diagnostics: readPreference("diagnostics", false),
  showMiniMap: readPreference("showMiniMap", true),
  bottomFractions: readFractions(),
  bottomEnlarged: false,
  set: (partial) => set(partial),
  notify: (tone, text, details, options = {}) => {
    const id = ++noticeSeq;
    const notice: Notice = { id, tone, text, details, ...options };
    // the same message again, or a newer one on the same topic, replaces the old one: nothing stacks
    const same = (n: Notice) => (n.tone === tone && n.text === text) || (options.topic !== undefined && n.topic === options.topic);
    set((s) => ({ notices: [...s.notices.filter((n) => !same(n)).slice(-3), notice] }));
    // information fades on its own; errors stay until dismissed
    if (tone === "info" && typeof setTimeout !== "undefined") setTimeout(() => set((s) => ({ notices: s.notices.filter((n) => n.id !== id) })), 8000);
  },
  dismiss: (id) => set((s) => ({ notices: s.notices.filter((n) => n.id !== id) })),
  dismissTopic: (topic) => set((s) => ({ notices: s.notices.filter((n) => n.topic !== topic) })),
}));

type ViewPreference = "diagnostics" | "showMiniMap";

/** ?diagnostics=1 (or ?showMiniMap=0) for one visit, else the user's saved choice (browser storage, never the project). */
function readPreference(key: ViewPreference, fallback: boolean): boolean {
  try {
    const query = typeof location !== "undefined" ? new URLSearchParams(location.search).get(key) : null;
    if (query === "1" || query === "0") return query === "1";
    const kept = typeof localStorage !== "undefined" ? localStorage.getItem(`islet.${key}`) : null;
    return kept === null ? fallback : kept === "1";
  } catch {
    return fallback;
  }
}


function readFractions(): Record<PaneId, number> {
  const out = { ...BOTTOM_START };
  try {
    const kept = JSON.parse((typeof localStorage !== "undefined" ? localStorage.getItem(FRACTION_KEY) : null) ?? "{}") as Record<string, unknown>;
    for (const id of Object.keys(out) as PaneId[]) {
      const f = kept[id];
      if (typeof f === "number" && f >= BOTTOM_FRACTION.min && f <= BOTTOM_FRACTION.max) out[id] = f;
    }
  } catch {
    // unreadable or refused storage: the starting heights
  }
  return out;
}

/** The lower pane's share of the height now (the shown pane's own). */
export function bottomFractionOf(s: Pick<SessionState, "bottomFractions" | "pane">): number {
  return s.bottomFractions[s.pane] ?? BOTTOM_START.fault;
}

/** The shown pane's splitter position, clamped, remembered for this user (not in the project). */
export function setBottomFraction(fraction: number, keep: boolean): void {
  const f = Math.min(BOTTOM_FRACTION.max, Math.max(BOTTOM_FRACTION.min, fraction));
  const s = useSessionStore.getState();
  const bottomFractions = { ...s.bottomFractions, [s.pane]: f };
  s.set({ bottomFractions, bottomEnlarged: false });
  if (!keep) return;
  try {
    localStorage.setItem(FRACTION_KEY, JSON.stringify(Object.fromEntries(Object.entries(bottomFractions).map(([k, v]) => [k, Math.round(v * 1000) / 1000]))));
  } catch {
    // storage refused: the position lasts for this visit only
  }
}

export function setViewPreference(key: ViewPreference, on: boolean): void {
  try {
    localStorage.setItem(`islet.${key}`, on ? "1" : "0");
  } catch {
    // storage refused (private mode): the choice lasts for this visit only
  }
  useSessionStore.getState().set({ [key]: on });
}
