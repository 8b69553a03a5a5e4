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

export interface Notice {
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
  notices: Notice[];
  set(partial: Partial<Omit<SessionState, "set" | "notify" | "dismiss">>): void;
  notify(tone: Notice["tone"], text: string, details?: string[]): void;
  dismiss(id: number): void;
}

let noticeSeq = 0;

export const useSessionStore = create<SessionState>()((set) => ({
  selection: [],
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
  set: (partial) => set(partial),
  notify: (tone, text, details) => {
    const id = ++noticeSeq;
    set((s) => ({ notices: [...s.notices.slice(-3), { id, tone, text, details }] }));
    // information fades on its own; errors stay until dismissed
    if (tone === "info" && typeof setTimeout !== "undefined") setTimeout(() => set((s) => ({ notices: s.notices.filter((n) => n.id !== id) })), 8000);
  },
  dismiss: (id) => set((s) => ({ notices: s.notices.filter((n) => n.id !== id) })),
}));
