// Public surface of the verdict pane.
export { VerdictPane } from "./VerdictPane.tsx";
export type { VerdictPaneProps } from "./VerdictPane.tsx";
export type { VerdictFilter } from "./verdictRows.ts";
