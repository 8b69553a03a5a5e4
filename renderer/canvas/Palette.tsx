// The element palette: drag an entry onto the one-line, or click it to place it in view
// (protective devices go on the selected element).
import type { DragEvent } from "react";
import type { ElementKind } from "../../src/model/schema.ts";
import { PALETTE_KINDS, paletteWords } from "./newElement.ts";
import { PaletteIcon } from "./symbols/PaletteIcon.tsx";

export const PALETTE_DRAG_TYPE = "application/x-islet-kind";

interface Props {
  onAdd(kind: ElementKind): void;
}

export function Palette({ onAdd }: Props) {
  const onDragStart = (e: DragEvent, kind: ElementKind) => {
    e.dataTransfer.setData(PALETTE_DRAG_TYPE, kind);
    e.dataTransfer.effectAllowed = "copy";
  };
  return (
    <nav className="palette" aria-label="Elements">
      <h2 className="pane-title">Parts</h2>
      {PALETTE_KINDS.map((kind) => (
        <button key={kind} className="palette-item" draggable onDragStart={(e) => onDragStart(e, kind)} onClick={() => onAdd(kind)} data-kind={kind} title={paletteWords(kind).title}>
          <PaletteIcon kind={kind} />
          <span>{paletteWords(kind).label}</span>
        </button>
      ))}
    </nav>
  );
}
