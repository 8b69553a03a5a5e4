// Messages for the user (file errors, saves, hints), each dismissable.
import { useSessionStore } from "../store/sessionStore.ts";

export function Notices() {
  const notices = useSessionStore((s) => s.notices);
  const dismiss = useSessionStore((s) => s.dismiss);
  if (notices.length === 0) return null;
  return (
    <div className="notices" aria-live="polite">
      {notices.map((n) => (
        <div key={n.id} className={`notice notice-${n.tone}`} data-testid={`notice-${n.tone}`}>
          <div className="notice-text">{n.text}</div>
          {n.details && n.details.length > 0 && (
            <ul className="notice-details">
              {n.details.slice(0, 8).map((d, i) => (
                <li key={i}>{d}</li>
              ))}
              {n.details.length > 8 && <li>… and {n.details.length - 8} more</li>}
            </ul>
          )}
          {n.action && (
            <button
              className="small-button notice-action"
              onClick={() => {
                n.action?.run();
                dismiss(n.id);
              }}
            >
              {n.action.label}
            </button>
          )}
          <button className="notice-close" onClick={() => dismiss(n.id)} aria-label="Dismiss">
            ×
          </button>
        </div>
      ))}
    </div>
  );
}
