// The window title: file name, a bullet when there are unsaved changes, then the app name,
// e.g. "dairy-coop.islet • — Islet".
export const APP_NAME = "Islet";

export function documentTitle(name: string, dirty: boolean): string {
  const shown = name.trim().length > 0 ? name.trim() : "Untitled";
  return `${shown}${dirty ? " •" : ""} — ${APP_NAME}`;
}
