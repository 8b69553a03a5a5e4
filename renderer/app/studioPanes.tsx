// The lower panes built outside the shell (chain, time-current, verdicts), mounted when present.
import type { PaneEntry } from "./BottomPanes.tsx";

export function studioPanes(): PaneEntry[] {
  return [];
}
