// Commands from the desktop app's native menu, run like their buttons and keys.
import type { HostApi, MenuCommand } from "../../src/model/hostContract.ts";
import { newDocument, openDocument, openDemo, openRecentDocument, saveDocument } from "../files/fileCommands.ts";
import { undo, redo } from "../store/documentStore.ts";
import { useSessionStore } from "../store/sessionStore.ts";
import { CAUTION_TEXT } from "./caution.ts";
import { commitPendingEdits } from "./pendingEdits.ts";

export function runMenuCommand(command: MenuCommand): void {
  commitPendingEdits();
  if (typeof command === "object") {
    void openRecentDocument(command.openRecent);
    return;
  }
  switch (command) {
    case "new":
      return void newDocument();
    case "open":
      return void openDocument();
    case "save":
      return void saveDocument(false);
    case "saveAs":
      return void saveDocument(true);
    case "openDemo":
      return void openDemo();
    case "undo":
      return undo();
    case "redo":
      return redo();
    case "about":
      return useSessionStore.getState().notify("info", `Islet, a protection studio for microgrids. ${CAUTION_TEXT}`);
  }
}

export function listenToMenu(host: HostApi): () => void {
  return host.onMenuCommand(runMenuCommand);
}
