// The native menu (project brief): File New/Open/Open demo/Save/Save as/Recent files/Quit;
// Edit Undo/Redo sent to the studio; View reload and devtools in development only; Help About.
import { describe, expect, it, vi } from "vitest";

vi.mock("electron", async () => (await import("./electronMock.ts")).electronMock());

import { Menu, type MenuItemConstructorOptions } from "electron";
import { buildMenuTemplate, installMenu, type MenuDeps } from "../../../main/menu.ts";

function deps(over: Partial<MenuDeps> = {}): MenuDeps {
  return { isMac: false, dev: false, recent: [], send: vi.fn(), showAbout: vi.fn(), ...over };
}

function submenu(template: MenuItemConstructorOptions[], label: string): MenuItemConstructorOptions[] {
  const top = template.find((m) => (m.label ?? "").replace("&", "") === label);
  if (!top) throw new Error(`no menu ${label}`);
  return top.submenu as MenuItemConstructorOptions[];
}

function item(items: MenuItemConstructorOptions[], label: string): MenuItemConstructorOptions {
  const found = items.find((m) => (m.label ?? "").replace(/&/g, "") === label);
  if (!found) throw new Error(`no item ${label}`);
  return found;
}

const click = (m: MenuItemConstructorOptions) => (m.click as unknown as () => void)();

describe("native menu", () => {
  it("sends each File command to the studio", () => {
    const d = deps();
    const file = submenu(buildMenuTemplate(d), "File");
    const expected: Array<[string, unknown]> = [
      ["New", "new"],
      ["Open…", "open"],
      ["Open demo", "openDemo"],
      ["Save", "save"],
      ["Save as…", "saveAs"],
    ];
    for (const [label] of expected) click(item(file, label));
    expect((d.send as ReturnType<typeof vi.fn>).mock.calls.map((c) => c[0])).toEqual(expected.map((e) => e[1]));
    expect(item(file, "Quit").role).toBe("quit");
  });

  it("lists recent files and opens the one picked", () => {
    const d = deps({ recent: [{ name: "a.islet", key: "/s/a.islet" }, { name: "b.islet", key: "/s/b.islet" }] });
    const recent = item(submenu(buildMenuTemplate(d), "File"), "Recent files").submenu as MenuItemConstructorOptions[];
    expect(recent.map((r) => r.label)).toEqual(["a.islet", "b.islet"]);
    click(recent[1]);
    expect(d.send).toHaveBeenCalledWith({ openRecent: { name: "b.islet", key: "/s/b.islet" } });
  });

  it("shows a disabled placeholder when there are no recent files", () => {
    const recent = item(submenu(buildMenuTemplate(deps()), "File"), "Recent files").submenu as MenuItemConstructorOptions[];
    expect(recent).toEqual([{ label: "No recent files", enabled: false }]);
  });

  it("sends Undo and Redo to the studio instead of the focused field", () => {
    const d = deps();
    const edit = submenu(buildMenuTemplate(d), "Edit");
    click(item(edit, "Undo"));
    click(item(edit, "Redo"));
    expect((d.send as ReturnType<typeof vi.fn>).mock.calls.map((c) => c[0])).toEqual(["undo", "redo"]);
    expect(item(edit, "Undo").role).toBeUndefined();
  });

  it("offers reload and developer tools only in development", () => {
    const roles = (dev: boolean) => submenu(buildMenuTemplate(deps({ dev })), "View").map((m) => m.role);
    expect(roles(true)).toEqual(expect.arrayContaining(["reload", "toggleDevTools"]));
    expect(roles(false)).not.toContain("reload");
    expect(roles(false)).not.toContain("toggleDevTools");
  });

  it("opens About from Help", () => {
    const d = deps();
    click(item(submenu(buildMenuTemplate(d), "Help"), "About Islet"));
    expect(d.showAbout).toHaveBeenCalled();
  });

  it("puts Quit in the app menu on macOS, not in File", () => {
    const t = buildMenuTemplate(deps({ isMac: true }));
    expect(t[0].label).toBe("Islet");
    expect(submenu(t, "File").some((m) => m.role === "quit")).toBe(false);
  });

  it("installs the built menu as the application menu", () => {
    installMenu(deps());
    expect(Menu.buildFromTemplate).toHaveBeenCalled();
    expect(Menu.setApplicationMenu).toHaveBeenCalled();
  });
});
