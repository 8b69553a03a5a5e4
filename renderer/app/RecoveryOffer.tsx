// After a crash: the autosaved text of unsaved work is offered back once at start-up.
import { useState } from "react";
import { loadProject } from "../../src/model/projectFile.ts";
import { currentHost } from "../host/currentHost.ts";
import { showProject } from "../files/fileCommands.ts";
import { useSessionStore } from "../store/sessionStore.ts";

export interface Recovery {
  text: string;
  savedAt: string;
}

export function RecoveryOffer({ recovery }: { recovery: Recovery }) {
  const [open, setOpen] = useState(true);
  if (!open) return null;
  const when = new Date(recovery.savedAt).toLocaleString();
  const restore = async () => {
    const result = loadProject(recovery.text);
    if (!result.ok) {
      useSessionStore.getState().notify("error", "The recovered work could not be read.", result.error.messages);
    } else {
      await showProject(result.project, null, true);
    }
    setOpen(false);
  };
  const discard = async () => {
    await currentHost().clearAutosave();
    setOpen(false);
  };
  return (
    <div className="recovery" role="alertdialog" aria-label="Recover unsaved work" data-testid="recovery">
      <span>Unsaved work from {when} was found. Restore it?</span>
      <button className="tool-button accent" onClick={() => void restore()}>
        Restore
      </button>
      <button className="tool-button" onClick={() => void discard()}>
        Discard
      </button>
    </div>
  );
}
