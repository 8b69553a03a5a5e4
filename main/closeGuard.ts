// Keeps unsaved work from being lost when the window closes (window button, Quit, OS logout).
// Dirty: ask Save / Discard / Cancel. Save asks the studio to save and closes once that save
// succeeds; a cancelled or failed save keeps the window open with the work in it.
export type CloseChoice = "save" | "discard" | "cancel";

export interface CloseGuardDeps {
  /** Shows the question synchronously, so the close event can still be cancelled. */
  ask(documentName: string): CloseChoice;
  /** Ask the studio to save (it answers through the normal save call). */
  requestSave(): void;
  /** Close the window for real (the guard lets this one through). */
  close(): void;
}

export interface CloseGuard {
  setState(state: { name: string; dirty: boolean }): void;
  readonly dirty: boolean;
  /** Handler for the window's "close" event. */
  onClose(event: { preventDefault(): void }): void;
  /** The outcome of every project save, so a save requested by the guard can finish the close. */
  saveFinished(ok: boolean): void;
}

export function createCloseGuard(deps: CloseGuardDeps): CloseGuard {
  let name = "";
  let dirty = false;
  let closeAfterSave = false;
  let letThrough = false;

  return {
    get dirty() {
      return dirty;
    },
    setState(state) {
      name = state.name;
      dirty = state.dirty;
    },
    onClose(event) {
      if (letThrough || !dirty) return;
      const choice = deps.ask(name);
      if (choice === "discard") {
        letThrough = true;
        return;
      }
      event.preventDefault();
      if (choice === "save") {
        closeAfterSave = true;
        deps.requestSave();
      }
    },
    saveFinished(ok) {
      if (!closeAfterSave) return;
      closeAfterSave = false;
      if (ok) {
        dirty = false;
        letThrough = true;
        deps.close();
      }
    },
  };
}

/** The native question: buttons in this order, Cancel on Escape. */
export const CLOSE_DIALOG_BUTTONS: readonly string[] = ["Save", "Discard", "Cancel"];

export function closeChoiceFromButton(index: number): CloseChoice {
  return index === 0 ? "save" : index === 1 ? "discard" : "cancel";
}
