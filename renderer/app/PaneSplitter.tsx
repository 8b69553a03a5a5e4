// The bar between the one-line and the lower panes: drag it (or focus it and use the arrow keys) to
// share the height between them; double-click puts it back. Each pane keeps its own height (the fault
// figures need little, the plot and the matrix more), per user, never in the project.
import { useRef, type KeyboardEvent, type PointerEvent } from "react";
import { useSessionStore, setBottomFraction, bottomFractionOf, BOTTOM_FRACTION, BOTTOM_START } from "../store/sessionStore.ts";

const KEY_STEP = 0.05;

export function PaneSplitter() {
  const fraction = useSessionStore(bottomFractionOf);
  const pane = useSessionStore((s) => s.pane);
  const drag = useRef<{ top: number; height: number } | null>(null);
  const fractionAt = (clientY: number) => {
    const d = drag.current;
    return d ? 1 - (clientY - d.top) / d.height : fraction;
  };
  const onPointerDown = (e: PointerEvent<HTMLDivElement>) => {
    const centre = e.currentTarget.parentElement?.getBoundingClientRect();
    if (!centre) return;
    drag.current = { top: centre.top, height: centre.height };
    e.currentTarget.setPointerCapture(e.pointerId);
    e.preventDefault();
  };
  const onPointerMove = (e: PointerEvent<HTMLDivElement>) => {
    if (drag.current) setBottomFraction(fractionAt(e.clientY), false);
  };
  const onPointerUp = (e: PointerEvent<HTMLDivElement>) => {
    if (!drag.current) return;
    setBottomFraction(fractionAt(e.clientY), true);
    drag.current = null;
  };
  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    const step = e.shiftKey ? KEY_STEP * 3 : KEY_STEP;
    if (e.key === "ArrowUp") setBottomFraction(fraction + step, true);
    else if (e.key === "ArrowDown") setBottomFraction(fraction - step, true);
    else if (e.key === "Home") setBottomFraction(BOTTOM_FRACTION.max, true);
    else if (e.key === "End") setBottomFraction(BOTTOM_FRACTION.min, true);
    else return;
    e.preventDefault();
  };
  return (
    <div
      className="pane-splitter"
      role="separator"
      aria-orientation="horizontal"
      aria-label="Height of the lower panes"
      aria-valuemin={Math.round(BOTTOM_FRACTION.min * 100)}
      aria-valuemax={Math.round(BOTTOM_FRACTION.max * 100)}
      aria-valuenow={Math.round(fraction * 100)}
      tabIndex={0}
      title="Drag to resize the lower panes (arrow keys when focused; double-click to reset)"
      data-testid="pane-splitter"
      onPointerDown={onPointerDown}
      onPointerMove={onPointerMove}
      onPointerUp={onPointerUp}
      onPointerCancel={onPointerUp}
      onDoubleClick={() => setBottomFraction(BOTTOM_START[pane], true)}
      onKeyDown={onKeyDown}
    />
  );
}
