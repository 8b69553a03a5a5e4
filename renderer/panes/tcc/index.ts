// Public surface of the time-current pane.
export { TccPane } from "./TccPane.tsx";
export type { TccPaneProps } from "./TccPane.tsx";
export type { TccBand, TccEquipmentCurve, TccMarkerPoint, TccFaultMark, TccSettingPatch, TccExportFile, CurvePoint } from "./tccTypes.ts";
export type { DragLimits } from "./dragSetting.ts";
