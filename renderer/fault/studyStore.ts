// Results of the protection study shown in the panes: the current fault's case (chains, device
// responses, verdicts) and the last full study with its progress. Session state.
import { create } from "zustand";
import type { CaseResult, StudyProgress, StudyResult, Verdict } from "../../src/study/types.ts";

export interface StudyState {
  caseResult: CaseResult | null;
  caseVerdicts: Verdict[];
  caseError: string | null;
  full: StudyResult | null;
  /** Revision of the document the full study was run on (stale when it differs). */
  fullRevision: number;
  running: { requestId: string; progress: StudyProgress | null } | null;
  set(partial: Partial<Omit<StudyState, "set">>): void;
}

export const useStudyStore = create<StudyState>()((set) => ({
  caseResult: null,
  caseVerdicts: [],
  caseError: null,
  full: null,
  fullRevision: -1,
  running: null,
  set: (partial) => set(partial),
}));
