// Shell side of the time-current pane: which devices to draw (the chain path of the selected device
// in the current fault, else the selected devices), referred to one voltage, with the fault current
// marked. A drag previews locally and becomes one undoable edit when released.
import { useMemo, useState } from "react";
import { isProtectiveDevice, type Element, type ProtectiveDevice } from "../../src/model/schema.ts";
import { TccPane, type TccEquipmentCurve, type TccFaultMark, type TccMarkerPoint, type TccSettingPatch } from "../panes/tcc/index.ts";
import { bandsFromDevices } from "../panes/tcc/bandsFromDevices.ts";
import { cableCurve, transformerCurves } from "../panes/tcc/equipmentCurves.ts";
import { useDocumentStore } from "../store/documentStore.ts";
import { useSessionStore } from "../store/sessionStore.ts";
import { useStudyStore } from "../fault/studyStore.ts";
import { useFaultStore } from "../fault/faultStore.ts";
import { currentHost } from "../host/currentHost.ts";
import { deviceKv } from "../../src/model/deviceBus.ts";
import { settingPatchChanges } from "./settingPatch.ts";

interface Preview {
  deviceId: string;
  functionId: string;
  patch: TccSettingPatch;
}

function patched(device: ProtectiveDevice, p: Preview | null): ProtectiveDevice {
  if (!p || p.deviceId !== device.id) return device;
  if (device.kind === "relay") return { ...device, functions: device.functions.map((f) => (f.id === p.functionId ? { ...f, ...p.patch } : f)) };
  if (device.kind === "fuse") return p.patch.pickup_A ? { ...device, rating_A: p.patch.pickup_A } : device;
  return p.patch.pickup_A ? { ...device, longTime: { ...device.longTime, ir_x: Math.min(1, Math.max(0.4, p.patch.pickup_A / device.in_A)) } } : device;
}

export function TimeCurrentView() {
  const doc = useDocumentStore((s) => s.doc);
  const selection = useSessionStore((s) => s.selection);
  const caseResult = useStudyStore((s) => s.caseResult);
  const fault = useFaultStore((s) => s.result);
  const [preview, setPreview] = useState<Preview | null>(null);
  const byId = useMemo(() => new Map<string, Element>(doc.elements.map((e) => [e.id, e])), [doc]);

  const plot = useMemo(() => {
    const selectedDevice = selection.map((id) => byId.get(id)).find((e): e is ProtectiveDevice => !!e && isProtectiveDevice(e));
    let ids: string[] = [];
    let pathElements: string[] = [];
    let title = "";
    const paths = caseResult?.chains.paths ?? [];
    if (paths.length > 0) {
      const path = paths.find((p) => p.links.some((l) => l.device === selectedDevice?.id)) ?? paths[0];
      ids = path.links.map((l) => l.device);
      pathElements = path.elements;
      title = `${caseResult?.faultCase.label ?? ""} · path to ${path.sourceName}`;
    }
    if (ids.length === 0) {
      ids = selection.filter((id) => {
        const e = byId.get(id);
        return !!e && isProtectiveDevice(e);
      });
      // a selected element brings the devices that look into it
      for (const id of selection) for (const e of doc.elements) if (isProtectiveDevice(e) && e.at.element === id) ids.push(e.id);
      title = ids.length ? "Selected devices" : "";
    }
    const devices = ids.map((id) => byId.get(id)).filter((e): e is ProtectiveDevice => !!e && isProtectiveDevice(e));
    const faultBus = fault?.location.kind === "bus" ? byId.get(fault.location.bus) : undefined;
    const reference_kV = faultBus?.kind === "bus" ? faultBus.un_kV : devices.length ? (deviceKv(devices[0], doc, byId) ?? 0.4) : 0.4;
    return { devices, reference_kV, title, pathElements };
  }, [doc, byId, selection, caseResult, fault]);

  const drawn = useMemo(() => {
    try {
      const list = plot.devices.map((d) => ({ device: patched(d, preview), device_kV: deviceKv(d, doc, byId) ?? plot.reference_kV }));
      return { bands: bandsFromDevices(list, { reference_kV: plot.reference_kV }), error: null as string | null };
    } catch (err) {
      return { bands: [], error: err instanceof Error ? err.message : String(err) };
    }
  }, [plot, preview, doc, byId]);

  const equipment = useMemo(() => {
    const curves: TccEquipmentCurve[] = [];
    const markers: TccMarkerPoint[] = [];
    for (const id of plot.pathElements) {
      const e = byId.get(id);
      try {
        if (e?.kind === "transformer") {
          const lvSide = byId.get(e.lvBus);
          const side = lvSide?.kind === "bus" && Math.abs(lvSide.un_kV - plot.reference_kV) < 1e-6 ? "lv" : "hv";
          const t = transformerCurves(e, side, plot.reference_kV);
          curves.push(t.curve);
          markers.push(t.inrush);
        } else if (e?.kind === "line") {
          const bus = byId.get(e.fromBus);
          if (bus?.kind === "bus") curves.push(cableCurve(e, bus.un_kV, plot.reference_kV));
        }
      } catch {
        // an element whose withstand cannot be drawn is left out; validation names it
      }
    }
    return { curves, markers };
  }, [plot, byId]);

  const faultMarks: TccFaultMark[] = useMemo(() => {
    if (!fault) return [];
    const at = fault.location.kind === "bus" ? byId.get(fault.location.bus) : undefined;
    const kv = at?.kind === "bus" ? at.un_kV : plot.reference_kV;
    return [{ id: "fault", label: `${fault.faultType} ${fault.options.limit} I"k`, current_A: fault.ikss_kA * 1000 * (kv / plot.reference_kV) }];
  }, [fault, byId, plot.reference_kV]);

  if (drawn.error) return <p className="pane-empty msg-error">{drawn.error}</p>;
  if (plot.devices.length === 0) return <p className="pane-empty">Select a relay, fuse or LV breaker (or the element it protects), or place a fault, to draw its time-current curves.</p>;
  return (
    <div className="tcc-host" data-testid="tcc-host">
      <TccPane
        referenceVoltage_kV={plot.reference_kV}
        title={plot.title}
        bands={drawn.bands}
        equipment={equipment.curves}
        markers={equipment.markers}
        faultMarks={faultMarks}
        highlightDeviceId={selection[0] ?? null}
        onDeviceSelect={(id) => useSessionStore.getState().set({ selection: [id] })}
        onSettingChange={(deviceId, functionId, patch, { final }) => {
          if (!final) {
            setPreview({ deviceId, functionId, patch });
            return;
          }
          setPreview(null);
          const device = byId.get(deviceId);
          if (device && isProtectiveDevice(device)) useDocumentStore.getState().applyChanges(settingPatchChanges(device, functionId, patch), { undoable: true });
        }}
        onExport={(file) => void currentHost().exportFile(file.suggestedName, file.data, file.mime)}
        onExportError={(message) => useSessionStore.getState().notify("error", message)}
        exportName={`${doc.meta.name} time-current`}
      />
    </div>
  );
}

