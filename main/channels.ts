// IPC channel names: one per HostApi call, shared by the main process and the preload.
// There is deliberately no generic channel: each carries one call with its own checked arguments.
export const CHANNELS = {
  openProject: "islet:open-project",
  openRecent: "islet:open-recent",
  loadDemo: "islet:load-demo",
  saveProject: "islet:save-project",
  listRecent: "islet:list-recent",
  setDocumentState: "islet:set-document-state",
  writeAutosave: "islet:write-autosave",
  readAutosave: "islet:read-autosave",
  clearAutosave: "islet:clear-autosave",
  exportFile: "islet:export-file",
  exportReportPdf: "islet:export-report-pdf",
  /** main -> renderer: a command from the native menu or the launch arguments. */
  menuCommand: "islet:menu-command",
} as const;

export type ChannelName = (typeof CHANNELS)[keyof typeof CHANNELS];
