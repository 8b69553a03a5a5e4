// Start-up: pick the host, start the engine client, autosave and the fault overlay, then open
// the first document: ?empty=1 an empty project, ?generate=N a generated radial network
// (benchmarks), otherwise the demo, with an offer to restore autosaved work if there is any.
import { createRoot } from "react-dom/client";
import "@xyflow/react/dist/style.css";
import "./styles/studio.css";
import { App } from "./app/App.tsx";
import { pickHost } from "./host/pickHost.ts";
import { setHost } from "./host/currentHost.ts";
import { startAutosave } from "./files/autosave.ts";
import { loadDemo, showProject } from "./files/fileCommands.ts";
import { newProject } from "../src/model/projectFile.ts";
import { createStudioPort } from "./worker/studioWorker.ts";
import { engineClient } from "./worker/engineClient.ts";
import { studyClient } from "./worker/studyClient.ts";
import { setStudyClient } from "./fault/studyCommands.ts";
import { startFaultRunner } from "./fault/faultRunner.ts";
import { useSessionStore } from "./store/sessionStore.ts";
import { studioPanes } from "./app/studioPanes.tsx";
import { listenToMenu } from "./app/menuCommands.ts";

async function start(): Promise<void> {
  const params = new URLSearchParams(location.search);
  const host = pickHost();
  setHost(host);
  if (params.get("theme") === "dark" || (!params.has("theme") && window.matchMedia?.("(prefers-color-scheme: dark)").matches)) {
    useSessionStore.getState().set({ theme: "dark" });
  }
  // two workers: the fault overlay never waits behind a study
  const preferWorker = params.get("worker") !== "0";
  const enginePort = createStudioPort(preferWorker, "islet-engine");
  const studyPort = createStudioPort(preferWorker, "islet-study");
  (window as unknown as { __isletEngineMode: string }).__isletEngineMode = enginePort.mode;
  const study = studyClient(studyPort.port);
  setStudyClient(study);
  startFaultRunner(engineClient(enginePort.port), study);

  const recovery = params.has("empty") || params.has("generate") ? null : await host.readAutosave().catch(() => null);
  const root = createRoot(document.getElementById("root") as HTMLElement);
  root.render(<App recovery={recovery} panes={studioPanes()} />);

  const generate = Number(params.get("generate"));
  if (params.has("empty")) {
    await showProject(newProject("Untitled project"), null);
  } else if (generate > 0) {
    const { generateRadialNetwork } = await import("../src/model/generateNetwork.ts");
    const buses = Math.max(2, Math.round(generate));
    const devices = Number(params.get("devices") ?? buses);
    await showProject(generateRadialNetwork({ buses, devices, seed: Number(params.get("seed") ?? 7) }), null);
  } else {
    await loadDemo();
  }
  startAutosave(host);
  listenToMenu(host);
  document.documentElement.dataset.ready = "1";
}

void start();
