// The native menu. Document commands go to the studio (it owns the document and the undo
// history); only window-level things (reload, developer tools, About) are handled here.
import { Menu, type MenuItemConstructorOptions } from "electron";
import type { FileRef, MenuCommand } from "../src/model/hostContract.ts";
import { APP_NAME } from "./documentTitle.ts";

export interface MenuDeps {
  isMac: boolean;
  /** Reload and developer tools appear only in development builds. */
  dev: boolean;
  recent: readonly FileRef[];
  send(command: MenuCommand): void;
  showAbout(): void;
}

export function buildMenuTemplate(deps: MenuDeps): MenuItemConstructorOptions[] {
  const { send } = deps;
  const recentItems: MenuItemConstructorOptions[] =
    deps.recent.length === 0
      ? [{ label: "No recent files", enabled: false }]
      : deps.recent.map((file) => ({ label: file.name, toolTip: file.key, click: () => send({ openRecent: file }) }));

  const file: MenuItemConstructorOptions = {
    label: "&File",
    submenu: [
      { label: "&New", accelerator: "CmdOrCtrl+N", click: () => send("new") },
      { label: "&Open…", accelerator: "CmdOrCtrl+O", click: () => send("open") },
      { label: "Open &demo", click: () => send("openDemo") },
      { label: "Recent &files", submenu: recentItems },
      { type: "separator" },
      { label: "&Save", accelerator: "CmdOrCtrl+S", click: () => send("save") },
      { label: "Save &as…", accelerator: "CmdOrCtrl+Shift+S", click: () => send("saveAs") },
      ...(deps.isMac ? [] : ([{ type: "separator" }, { label: "&Quit", role: "quit", accelerator: "CmdOrCtrl+Q" }] as MenuItemConstructorOptions[])),
    ],
  };

  // Undo/redo belong to the studio's document history, not to the focused text field.
  const edit: MenuItemConstructorOptions = {
    label: "&Edit",
    submenu: [
      { label: "&Undo", accelerator: "CmdOrCtrl+Z", click: () => send("undo") },
      { label: "&Redo", accelerator: deps.isMac ? "Cmd+Shift+Z" : "Ctrl+Y", click: () => send("redo") },
      { type: "separator" },
      { role: "cut" },
      { role: "copy" },
      { role: "paste" },
      { role: "selectAll" },
    ],
  };

  const view: MenuItemConstructorOptions = {
    label: "&View",
    submenu: [
      ...(deps.dev ? ([{ role: "reload" }, { role: "forceReload" }, { role: "toggleDevTools" }, { type: "separator" }] as MenuItemConstructorOptions[]) : []),
      { role: "resetZoom" },
      { role: "zoomIn" },
      { role: "zoomOut" },
      { type: "separator" },
      { role: "togglefullscreen" },
    ],
  };

  const help: MenuItemConstructorOptions = {
    label: "&Help",
    role: "help",
    submenu: [{ label: `&About ${APP_NAME}`, click: () => deps.showAbout() }],
  };

  const app: MenuItemConstructorOptions[] = deps.isMac
    ? [
        {
          label: APP_NAME,
          submenu: [
            { label: `About ${APP_NAME}`, click: () => deps.showAbout() },
            { type: "separator" },
            { role: "hide" },
            { role: "hideOthers" },
            { role: "unhide" },
            { type: "separator" },
            { role: "quit" },
          ],
        },
      ]
    : [];

  return [...app, file, edit, view, help];
}

export function installMenu(deps: MenuDeps): void {
  Menu.setApplicationMenu(Menu.buildFromTemplate(buildMenuTemplate(deps)));
}
