// Size limits for what the renderer may hand to the main process. Generous for real projects,
// small enough that a runaway renderer cannot fill the disk or the main process's memory.
export const LIMITS = {
  /** A project document's text (UTF-16 code units). */
  projectText_chars: 64 * 1024 * 1024,
  /** A project file read from disk. */
  projectFile_bytes: 64 * 1024 * 1024,
  /** An exported report, CSV, SVG or PNG. */
  export_bytes: 128 * 1024 * 1024,
  /** A report's HTML to print to PDF (UTF-16 code units). */
  reportHtml_chars: 64 * 1024 * 1024,
  /** Display names and suggested file names. */
  name_chars: 255,
  /** File keys (absolute paths). */
  path_chars: 4096,
  /** MIME type strings. */
  mime_chars: 127,
} as const;
