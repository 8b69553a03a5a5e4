// The preload bridge: exposes exactly the HostApi as window.isletHost, each call on its own
// IPC channel. Runs sandboxed, so it is bundled into one CommonJS file that only requires
// "electron". Menu commands that arrive before the studio subscribes are kept and delivered
// to the first subscriber, so the launch command (open a file, open the demo) is not lost.
import { contextBridge, ipcRenderer, type IpcRendererEvent } from "electron";
import type { FileRef, HostApi, MenuCommand, OpenedFile, SaveResult } from "../src/model/hostContract.ts";
import { CHANNELS } from "./channels.ts";

type MenuHandler = (command: MenuCommand) => void;

export interface BridgeIpc {
  invoke(channel: string, ...args: unknown[]): Promise<unknown>;
  send(channel: string, ...args: unknown[]): void;
  on(channel: string, listener: (event: IpcRendererEvent, ...args: unknown[]) => void): unknown;
}

export function createHostBridge(ipc: BridgeIpc): HostApi {
  const handlers = new Set<MenuHandler>();
  const early: MenuCommand[] = [];
  ipc.on(CHANNELS.menuCommand, (_event, command) => {
    if (handlers.size === 0) early.push(command as MenuCommand);
    else for (const h of handlers) h(command as MenuCommand);
  });

  return {
    kind: "desktop",
    openProject: () => ipc.invoke(CHANNELS.openProject) as Promise<OpenedFile | null>,
    openRecent: (file: FileRef) => ipc.invoke(CHANNELS.openRecent, file) as Promise<OpenedFile>,
    loadDemo: () => ipc.invoke(CHANNELS.loadDemo) as Promise<OpenedFile>,
    saveProject: (text: string, file: FileRef | null, saveAs: boolean) => ipc.invoke(CHANNELS.saveProject, text, file, saveAs) as Promise<SaveResult>,
    listRecent: () => ipc.invoke(CHANNELS.listRecent) as Promise<FileRef[]>,
    setDocumentState: (state: { name: string; dirty: boolean }) => ipc.send(CHANNELS.setDocumentState, state),
    writeAutosave: (text: string) => ipc.invoke(CHANNELS.writeAutosave, text) as Promise<void>,
    readAutosave: () => ipc.invoke(CHANNELS.readAutosave) as Promise<{ text: string; savedAt: string } | null>,
    clearAutosave: () => ipc.invoke(CHANNELS.clearAutosave) as Promise<void>,
    exportFile: (suggestedName: string, data: string | Uint8Array, mime: string) => ipc.invoke(CHANNELS.exportFile, suggestedName, data, mime) as Promise<boolean>,
    exportReportPdf: (suggestedName: string, html: string) => ipc.invoke(CHANNELS.exportReportPdf, suggestedName, html) as Promise<boolean>,
    onMenuCommand(handler: MenuHandler) {
      handlers.add(handler);
      if (early.length > 0) {
        const pending = early.splice(0);
        queueMicrotask(() => pending.forEach((c) => handler(c)));
      }
      return () => {
        handlers.delete(handler);
      };
    },
  };
}

contextBridge.exposeInMainWorld("isletHost", createHostBridge(ipcRenderer));
