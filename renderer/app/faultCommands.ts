// Fault on click: F (or the toolbar) faults the selected bus, or the selected line at its middle.
import { useDocumentStore } from "../store/documentStore.ts";
import { useSessionStore } from "../store/sessionStore.ts";

export function faultAtSelection(): void {
  const session = useSessionStore.getState();
  const { doc } = useDocumentStore.getState();
  const el = doc.elements.find((e) => e.id === session.selection[0]);
  if (el?.kind === "bus") session.set({ faultTarget: { kind: "bus", bus: el.id } });
  else if (el?.kind === "line") session.set({ faultTarget: { kind: "line", line: el.id, pct: 50 } });
  else session.notify("info", "Select a bus, or a line or cable, then press F to place a fault there.");
}

export function clearFault(): void {
  useSessionStore.getState().set({ faultTarget: null });
}
