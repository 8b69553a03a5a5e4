// Fields commit on Enter or when they lose focus. A command that reads the document (save, report,
// study) first commits the field being typed in, so nothing typed is ever lost; focus stays there.
export function commitPendingEdits(): void {
  if (typeof document === "undefined") return;
  const el = document.activeElement;
  if (!(el instanceof HTMLInputElement || el instanceof HTMLTextAreaElement || el instanceof HTMLSelectElement)) return;
  // the blur runs the field's commit synchronously (React's focusout handler), then focus returns
  el.blur();
  if (el.isConnected) el.focus();
}
