// The close guard: closing with unsaved work asks Save / Discard / Cancel (project brief), and a
// cancelled or failed save never closes the window.
import { describe, expect, it, vi } from "vitest";
import { CLOSE_DIALOG_BUTTONS, closeChoiceFromButton, createCloseGuard, type CloseChoice } from "../../../main/closeGuard.ts";

function guardAnswering(choice: CloseChoice) {
  const deps = { ask: vi.fn((_name: string) => choice), requestSave: vi.fn(), close: vi.fn() };
  return { guard: createCloseGuard(deps), deps };
}

function closeEvent() {
  return { preventDefault: vi.fn() };
}

describe("close guard", () => {
  it("closes without asking when everything is saved", () => {
    const { guard, deps } = guardAnswering("cancel");
    guard.setState({ name: "site.islet", dirty: false });
    const e = closeEvent();
    guard.onClose(e);
    expect(deps.ask).not.toHaveBeenCalled();
    expect(e.preventDefault).not.toHaveBeenCalled();
  });

  it("asks, naming the document, when there are unsaved changes", () => {
    const { guard, deps } = guardAnswering("cancel");
    guard.setState({ name: "dairy-coop.islet", dirty: true });
    guard.onClose(closeEvent());
    expect(deps.ask).toHaveBeenCalledWith("dairy-coop.islet");
  });

  it("keeps the window open on Cancel", () => {
    const { guard, deps } = guardAnswering("cancel");
    guard.setState({ name: "a", dirty: true });
    const e = closeEvent();
    guard.onClose(e);
    expect(e.preventDefault).toHaveBeenCalled();
    expect(deps.requestSave).not.toHaveBeenCalled();
  });

  it("lets the window close on Discard", () => {
    const { guard } = guardAnswering("discard");
    guard.setState({ name: "a", dirty: true });
    const e = closeEvent();
    guard.onClose(e);
    expect(e.preventDefault).not.toHaveBeenCalled();
  });

  it("on Save, asks the studio to save and closes only after the save succeeded", () => {
    const { guard, deps } = guardAnswering("save");
    guard.setState({ name: "a", dirty: true });
    const e = closeEvent();
    guard.onClose(e);
    expect(e.preventDefault).toHaveBeenCalled();
    expect(deps.requestSave).toHaveBeenCalledTimes(1);
    expect(deps.close).not.toHaveBeenCalled();
    guard.saveFinished(true);
    expect(deps.close).toHaveBeenCalledTimes(1);
    const again = closeEvent();
    guard.onClose(again); // the close the guard itself triggers goes through
    expect(again.preventDefault).not.toHaveBeenCalled();
  });

  it("keeps the window and the work when the requested save fails or is cancelled", () => {
    const { guard, deps } = guardAnswering("save");
    guard.setState({ name: "a", dirty: true });
    guard.onClose(closeEvent());
    guard.saveFinished(false);
    expect(deps.close).not.toHaveBeenCalled();
    expect(guard.dirty).toBe(true);
    guard.saveFinished(true); // a later ordinary save must not close the window by surprise
    expect(deps.close).not.toHaveBeenCalled();
  });

  it("maps the dialog buttons Save, Discard, Cancel in that order", () => {
    expect(CLOSE_DIALOG_BUTTONS).toEqual(["Save", "Discard", "Cancel"]);
    expect([0, 1, 2, -1].map(closeChoiceFromButton)).toEqual(["save", "discard", "cancel", "cancel"]);
  });
});
