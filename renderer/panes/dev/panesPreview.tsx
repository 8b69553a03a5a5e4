// Preview page of the analysis panes with sample data, for development and screenshots.
// URL flags: ?theme=dark, ?pane=tcc|chain|verdicts (one pane full-page), ?buses=N (matrix size),
// ?case=<case id> (initial selection), ?empty=1 (empty states and a notice).
// Callbacks are recorded on window.__panes so a browser script can check them.
import { StrictMode, useMemo, useState } from "react";
import { createRoot } from "react-dom/client";
import type { ProtectiveDevice } from "../../../src/model/schema.ts";
import { TccPane, type TccExportFile, type TccSettingPatch } from "../tcc/index.ts";
import { ChainPane } from "../chain/index.ts";
import { VerdictPane } from "../verdicts/index.ts";
import { bandsFromDevices, type DeviceOnPlot } from "../tcc/bandsFromDevices.ts";
import { cableCurve, motorCurve, transformerCurves } from "../tcc/equipmentCurves.ts";
import { REFERENCE_KV, sampleCable, sampleCaseId, sampleChains, sampleDevices, sampleFaultMarks, sampleMatrix, sampleMotor, sampleResponses, sampleTransformer } from "./sampleStudy.ts";
import "../../styles/studio.css";

interface PreviewLog {
  settings: { deviceId: string; functionId: string; patch: TccSettingPatch; final: boolean }[];
  steps: string[];
  selects: string[];
  selections: { caseId: string; scenarioId: string }[];
  exports: { suggestedName: string; mime: string; size: number; text?: string; base64?: string }[];
  errors: string[];
}
declare global {
  interface Window {
    __panes: PreviewLog;
  }
}
window.__panes = { settings: [], steps: [], selects: [], selections: [], exports: [], errors: [] };

const params = new URLSearchParams(location.search);
document.documentElement.dataset.theme = params.get("theme") === "dark" ? "dark" : "light";
const only = params.get("pane");
const buses = Number(params.get("buses") ?? "40");
const empty = params.get("empty") === "1";

function toBase64(bytes: Uint8Array): string {
  let s = "";
  for (let k = 0; k < bytes.length; k += 0x8000) s += String.fromCharCode(...bytes.subarray(k, k + 0x8000));
  return btoa(s);
}

function applyPatch(d: ProtectiveDevice, functionId: string, patch: TccSettingPatch): ProtectiveDevice {
  switch (d.kind) {
    case "relay":
      return { ...d, functions: d.functions.map((f) => (f.id === functionId ? { ...f, ...patch } : f)) };
    case "fuse":
      return patch.pickup_A ? { ...d, rating_A: patch.pickup_A } : d;
    case "lvbreaker":
      return patch.pickup_A ? { ...d, longTime: { ...d.longTime, ir_x: Math.min(1, Math.max(0.4, patch.pickup_A / d.in_A)) } } : d;
  }
}

function Preview() {
  const [devices, setDevices] = useState<DeviceOnPlot[]>(sampleDevices);
  const [step, setStep] = useState<string | null>("Q-WS");
  const [caseId, setCaseId] = useState<string | null>(params.get("case") ?? sampleCaseId);
  const bands = useMemo(() => {
    try {
      return bandsFromDevices(devices, { reference_kV: REFERENCE_KV });
    } catch (err) {
      window.__panes.errors.push(String(err));
      return [];
    }
  }, [devices]);
  const equipment = useMemo(() => {
    const tx = transformerCurves(sampleTransformer, "lv", REFERENCE_KV);
    return { curves: [tx.curve, cableCurve(sampleCable, 0.4, REFERENCE_KV), motorCurve(sampleMotor, REFERENCE_KV)], markers: [tx.inrush] };
  }, []);
  const study = useMemo(() => sampleMatrix(buses), []);

  const onSettingChange = (deviceId: string, functionId: string, patch: TccSettingPatch, o: { final: boolean }) => {
    window.__panes.settings.push({ deviceId, functionId, patch, final: o.final });
    setDevices((ds) => ds.map((d) => (d.device.id === deviceId ? { ...d, device: applyPatch(d.device, functionId, patch) } : d)));
  };
  const onExport = (f: TccExportFile) => {
    window.__panes.exports.push({ suggestedName: f.suggestedName, mime: f.mime, size: typeof f.data === "string" ? f.data.length : f.data.byteLength, text: typeof f.data === "string" ? f.data : undefined, base64: typeof f.data === "string" ? undefined : toBase64(f.data) });
  };

  const tcc = (
    <TccPane
      referenceVoltage_kV={REFERENCE_KV}
      title="3ph fault at B-WS · path from the utility tie"
      bands={empty ? [] : bands}
      equipment={empty ? [] : equipment.curves}
      markers={empty ? [] : equipment.markers}
      faultMarks={empty ? [] : sampleFaultMarks}
      notice={empty ? 'Relay R-TX1 "TX1 HV feeder": functions[0].pickup_A must be > 0 (got -3)' : null}
      highlightDeviceId={step}
      onSettingChange={onSettingChange}
      onDeviceSelect={(id) => {
        window.__panes.selects.push(id);
        setStep(id);
      }}
      onExport={onExport}
      onExportError={(m) => window.__panes.errors.push(m)}
      exportName="tcc B-WS 3ph"
    />
  );
  const chain = (
    <ChainPane
      chains={caseId === sampleCaseId && !empty ? sampleChains : null}
      caseLabel="3ph max fault at B-WS (islanded)"
      responses={sampleResponses}
      verdicts={study.verdicts}
      selectedDeviceId={step}
      onStepChange={(d) => {
        window.__panes.steps.push(d);
        setStep(d);
      }}
    />
  );
  const verdicts = (
    <VerdictPane
      matrix={empty ? null : study.matrix}
      verdicts={study.verdicts}
      selectedCaseId={caseId}
      subtitle="sample study"
      onSelectCase={(c, s) => {
        window.__panes.selections.push({ caseId: c, scenarioId: s });
        setCaseId(c);
      }}
    />
  );
  if (only === "tcc") return <div style={{ height: "100vh" }}>{tcc}</div>;
  if (only === "chain") return <div style={{ height: "100vh" }}>{chain}</div>;
  if (only === "verdicts") return <div style={{ height: "100vh" }}>{verdicts}</div>;
  return (
    <div style={{ display: "grid", gridTemplateColumns: "minmax(0, 1.35fr) minmax(0, 1fr)", gridTemplateRows: "minmax(0, 0.9fr) minmax(0, 1.1fr)", height: "100vh", gap: 1, background: "var(--line)" }}>
      <div style={{ gridRow: "1 / span 2", minHeight: 0 }}>{tcc}</div>
      <div style={{ minHeight: 0 }}>{chain}</div>
      <div style={{ minHeight: 0 }}>{verdicts}</div>
    </div>
  );
}

// One root even when the dev server re-runs this module after an edit.
const host = document.getElementById("root") as HTMLElement & { __root?: ReturnType<typeof createRoot> };
host.__root ??= createRoot(host);
host.__root.render(
  <StrictMode>
    <Preview />
  </StrictMode>,
);
