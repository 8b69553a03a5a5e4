// Verdict statuses as the panes rank and colour them. Worst first: a fail outranks a warning.

export type VerdictStatus = "fail" | "warn" | "pass";

export const VERDICT_STATUSES: readonly VerdictStatus[] = ["fail", "warn", "pass"];

const RANK: Record<VerdictStatus, number> = { fail: 3, warn: 2, pass: 1 };

/** The worse of two statuses; null means "no verdict" and loses to any status. */
export function worseStatus(a: VerdictStatus | null, b: VerdictStatus | null): VerdictStatus | null {
  if (a === null) return b;
  if (b === null) return a;
  return RANK[a] >= RANK[b] ? a : b;
}

/** CSS class suffix and human label per status. */
export const STATUS_LABEL: Record<VerdictStatus, string> = { fail: "Fail", warn: "Warning", pass: "Pass" };
