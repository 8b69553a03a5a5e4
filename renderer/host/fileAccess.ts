// The File System Access API where the browser offers it (Chromium does): a save writes through a file handle
// and resolves only once the browser has written the file, so "Saved" is true. Elsewhere the studio falls
// back to a download, which the page cannot see finish (see browserHost.ts).

/** The parts of the API used here (not every TypeScript DOM library declares the pickers). */
export interface WritableHandle {
  readonly name: string;
  createWritable(): Promise<{ write(data: string): Promise<void>; close(): Promise<void> }>;
  getFile(): Promise<File>;
  queryPermission?(options: { mode: "readwrite" }): Promise<PermissionState>;
  requestPermission?(options: { mode: "readwrite" }): Promise<PermissionState>;
}
interface PickerOptions {
  suggestedName?: string;
  types?: { description: string; accept: Record<string, string[]> }[];
  excludeAcceptAllOption?: boolean;
}
export interface FilePickers {
  showSaveFilePicker(options: PickerOptions): Promise<WritableHandle>;
  showOpenFilePicker(options: PickerOptions & { multiple?: boolean }): Promise<WritableHandle[]>;
}

const PROJECT_TYPES = [{ description: "Islet project", accept: { "application/json": [".islet"] } }];

/** The pickers of `scope` (the window), or null where the browser has none. */
export function filePickers(scope: unknown): FilePickers | null {
  const s = scope as Partial<FilePickers> | null | undefined;
  return s && typeof s.showSaveFilePicker === "function" && typeof s.showOpenFilePicker === "function" ? (s as FilePickers) : null;
}

/** True for the error a picker gives when the user closes it. */
export function isPickerCancel(err: unknown): boolean {
  return typeof err === "object" && err !== null && (err as { name?: unknown }).name === "AbortError";
}

export async function pickSaveHandle(pickers: FilePickers, suggestedName: string): Promise<WritableHandle | null> {
  try {
    return await pickers.showSaveFilePicker({ suggestedName, types: PROJECT_TYPES });
  } catch (err) {
    if (isPickerCancel(err)) return null;
    throw err;
  }
}

export async function pickOpenHandle(pickers: FilePickers): Promise<WritableHandle | null> {
  try {
    const [handle] = await pickers.showOpenFilePicker({ types: PROJECT_TYPES, multiple: false });
    return handle ?? null;
  } catch (err) {
    if (isPickerCancel(err)) return null;
    throw err;
  }
}

/** Writes `text` to the file; resolves once the browser has written it (close() commits the write). */
export async function writeThroughHandle(handle: WritableHandle, text: string): Promise<void> {
  if (handle.queryPermission && (await handle.queryPermission({ mode: "readwrite" })) !== "granted") {
    const asked = handle.requestPermission ? await handle.requestPermission({ mode: "readwrite" }) : "denied";
    if (asked !== "granted") throw new Error("the browser was not allowed to write the file");
  }
  const writable = await handle.createWritable();
  await writable.write(text);
  await writable.close();
}
