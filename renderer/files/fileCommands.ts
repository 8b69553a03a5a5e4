// New, Open, Save, Save as, recent files and the demo, through the host adapter.
// A bad file keeps the current document and shows the loader's messages; a failed save keeps
// the document and says why.
import { loadProject, newProject, serializeProject } from "../../src/model/projectFile.ts";
import type { FileRef, OpenedFile } from "../../src/model/hostContract.ts";
import type { Project } from "../../src/model/schema.ts";
import { useDocumentStore, clearHistory } from "../store/documentStore.ts";
import { useSessionStore } from "../store/sessionStore.ts";
import { currentHost } from "../host/currentHost.ts";
import { autoLayout } from "../canvas/autoLayout.ts";
import { useFaultStore } from "../fault/faultStore.ts";
import { useStudyStore } from "../fault/studyStore.ts";

export function isDirty(): boolean {
  return useDocumentStore.getState().revision !== useSessionStore.getState().savedRevision;
}

/** Asks whether an offered download arrived; only a yes marks the document saved. */
function confirmDownload(name: string): boolean {
  return window.confirm(`Is "${name}" in your downloads now?\n\nOK marks the project as saved. Cancel keeps it marked unsaved (and its recovery copy), for example when the browser blocked or failed the download.`);
}

function confirmDiscard(): boolean {
  return !isDirty() || window.confirm("Discard the unsaved changes to this project?");
}

/** Elements without a place on the one-line (imported or generated networks). */
function missingPlaces(project: Project): boolean {
  return project.elements.some((e) => e.kind !== "relay" && e.kind !== "fuse" && e.kind !== "lvbreaker" && !Object.hasOwn(project.layout, e.id));
}

/** Makes `project` the open document: no history, nothing selected, clean unless `dirty`. */
export async function showProject(project: Project, file: FileRef | null, dirty = false): Promise<void> {
  let doc = project;
  if (missingPlaces(doc)) doc = { ...doc, layout: { ...(await autoLayout(doc)), ...doc.layout } };
  const store = useDocumentStore.getState();
  store.applyChanges([{ type: "replaceDocument", project: doc }], { undoable: false });
  clearHistory();
  const revision = useDocumentStore.getState().revision;
  const session = useSessionStore.getState();
  useFaultStore.getState().set({ overlay: null, result: null, status: "idle", error: null });
  useStudyStore.getState().set({ full: null, caseResult: null, caseVerdicts: [], running: null });
  session.set({
    file,
    selection: [],
    faultTarget: null,
    savedRevision: dirty ? -1 : revision,
    activeScenarioId: doc.scenarios[0]?.id ?? null,
    fitSeq: session.fitSeq + 1,
  });
}

/** Loads a file's text; on failure keeps the current document and shows why. Returns success. */
export async function openText(opened: OpenedFile): Promise<boolean> {
  const result = loadProject(opened.text);
  const session = useSessionStore.getState();
  const name = opened.file?.name ?? "the file";
  if (!result.ok) {
    session.notify("error", `Could not open ${name}: the current project is kept.`, result.error.messages);
    return false;
  }
  await showProject(result.project, opened.file);
  if (result.warnings.length > 0) session.notify("info", `Opened ${name} with notes.`, result.warnings);
  return true;
}

export async function newDocument(): Promise<void> {
  if (!confirmDiscard()) return;
  await showProject(newProject("Untitled project"), null);
}

export async function openDocument(): Promise<void> {
  if (!confirmDiscard()) return;
  try {
    const opened = await currentHost().openProject();
    if (opened) await openText(opened);
  } catch (err) {
    useSessionStore.getState().notify("error", `Could not open the file: ${err instanceof Error ? err.message : String(err)}`);
  }
}

export async function openRecentDocument(file: FileRef): Promise<void> {
  if (!confirmDiscard()) return;
  try {
    await openText(await currentHost().openRecent(file));
  } catch (err) {
    useSessionStore.getState().notify("error", err instanceof Error ? err.message : String(err));
  }
}

export async function openDemo(): Promise<void> {
  if (!confirmDiscard()) return;
  await loadDemo();
}

export async function loadDemo(): Promise<boolean> {
  try {
    return await openText(await currentHost().loadDemo());
  } catch (err) {
    useSessionStore.getState().notify("error", err instanceof Error ? err.message : String(err));
    return false;
  }
}

/** Saves; on failure the document stays open and unsaved, and the message says why. */
export async function saveDocument(saveAs = false): Promise<boolean> {
  const { doc, revision } = useDocumentStore.getState();
  const session = useSessionStore.getState();
  let text: string;
  try {
    text = serializeProject(doc);
  } catch (err) {
    session.notify("error", `Could not write the project: ${err instanceof Error ? err.message : String(err)}. Nothing was lost.`);
    return false;
  }
  try {
    const host = currentHost();
    const result = await host.saveProject(text, session.file, saveAs);
    if (!result.ok) {
      if (!result.cancelled) session.notify("error", `${result.message} Your work is still open and unsaved.`);
      return false;
    }
    if (result.unconfirmed) {
      // a download: the browser may still refuse it, and the page never hears. Unsaved until the user says so.
      useSessionStore.getState().set({ file: result.file });
      if (!confirmDownload(result.file.name)) {
        session.notify("info", `Offered ${result.file.name} as a download. The browser does not tell the studio whether it was written, so the project stays marked unsaved and its recovery copy is kept.`);
        return false;
      }
    }
    useSessionStore.getState().set({ file: result.file, savedRevision: revision });
    await host.clearAutosave();
    session.notify("info", `Saved ${result.file.name}.`);
    return true;
  } catch (err) {
    session.notify("error", `Could not save: ${err instanceof Error ? err.message : String(err)}. Your work is still open and unsaved.`);
    return false;
  }
}
