// Public surface of the chain pane.
export { ChainPane } from "./ChainPane.tsx";
export type { ChainPaneProps } from "./ChainPane.tsx";
