// Native file dialogs, attached to the studio window. The project filter is ".islet".
import { dialog, type BrowserWindow, type FileFilter } from "electron";
import { resolve } from "node:path";
import type { FileDialogs } from "./ipc.ts";

export const PROJECT_FILTER: FileFilter = { name: "Islet project", extensions: ["islet"] };

export function exportFilters(extension: string): FileFilter[] {
  const ext = extension.replace(/[^A-Za-z0-9]/g, "").toLowerCase();
  return ext ? [{ name: `${ext.toUpperCase()} file`, extensions: [ext] }, { name: "All files", extensions: ["*"] }] : [{ name: "All files", extensions: ["*"] }];
}

export function electronFileDialogs(getWindow: () => BrowserWindow | null, defaultFolder: () => string): FileDialogs {
  return {
    async chooseProjectToOpen() {
      const options = { title: "Open project", filters: [PROJECT_FILTER], properties: ["openFile" as const] };
      const win = getWindow();
      const r = win ? await dialog.showOpenDialog(win, options) : await dialog.showOpenDialog(options);
      return r.canceled || r.filePaths.length === 0 ? null : r.filePaths[0];
    },
    async chooseProjectSavePath(suggestedName) {
      const options = {
        title: "Save project",
        defaultPath: resolve(defaultFolder(), suggestedName), // a full path (asking again on a corrected name) stays as it is
        filters: [PROJECT_FILTER],
        properties: ["showOverwriteConfirmation" as const, "createDirectory" as const],
      };
      const win = getWindow();
      const r = win ? await dialog.showSaveDialog(win, options) : await dialog.showSaveDialog(options);
      return r.canceled || !r.filePath ? null : r.filePath;
    },
    async chooseExportPath(suggestedName, extension) {
      const options = {
        title: "Export",
        defaultPath: resolve(defaultFolder(), suggestedName), // a full path (asking again on a corrected name) stays as it is
        filters: exportFilters(extension),
        properties: ["showOverwriteConfirmation" as const, "createDirectory" as const],
      };
      const win = getWindow();
      const r = win ? await dialog.showSaveDialog(win, options) : await dialog.showSaveDialog(options);
      return r.canceled || !r.filePath ? null : r.filePath;
    },
  };
}
