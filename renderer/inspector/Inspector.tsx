// "Properties": the selected element's fields with units and the model's validation messages
// beside them. Several elements of one kind are edited together (common fields); of mixed kinds,
// only the fields they share. Every edit is one undoable change through the document store.
import { ownValue } from "../../src/model/ownValue.ts";
import { useMemo } from "react";
import { isProtectiveDevice, type Element, type ElementKind } from "../../src/model/schema.ts";
import { validationOf } from "../store/validation.ts";
import { elementLabel } from "../../src/model/elementLabel.ts";
import { useDocumentStore } from "../store/documentStore.ts";
import { useSessionStore } from "../store/sessionStore.ts";
import type { DocChange } from "../store/changes.ts";
import { fieldsOfKind, type FieldSpec } from "./fieldModel.ts";
import { FieldList } from "./FieldList.tsx";
import { overloadWarnings } from "./overloadNote.ts";
import { messageText } from "./messageText.ts";
import { TextInput, type RowContext } from "./FieldRow.tsx";
import { addElement, deviceLocationOn } from "../canvas/editCommands.ts";
import { kindName } from "../canvas/newElement.ts";
import { DEFAULT_BUS_WIDTH } from "../canvas/toFlow.ts";

function commonSpecs(kinds: ElementKind[]): FieldSpec[] {
  const lists = kinds.map(fieldsOfKind);
  return lists[0].filter((f) => f.type !== "group" && f.type !== "list" && f.key !== "id" && lists.every((l) => l.some((g) => g.key === f.key && g.type === f.type)));
}

const PROJECT_FIELD_LABELS = { name: "Name", author: "Author", description: "Description" } as const;

/** Project name, author and description: each commits on Enter and on leaving the field (and before
 * a save, report or study: app/pendingEdits.ts). */
function ProjectFields() {
  const meta = useDocumentStore((s) => s.doc.meta);
  const apply = useDocumentStore((s) => s.applyChanges);
  const count = useDocumentStore((s) => s.doc.elements.length);
  return (
    <div className="inspector-body">
      <p className="field-note">Nothing selected. Project:</p>
      {(["name", "author", "description"] as const).map((field) => (
        <div className="field-row" key={field} data-field={`meta.${field}`}>
          <label className="field-label">{PROJECT_FIELD_LABELS[field]}</label>
          <div className="field-control">
            <TextInput
              label={`Project ${field}`}
              value={meta[field]}
              readOnly={false}
              onCommit={(value) => {
                if (field === "name" && value.trim() === "") {
                  useSessionStore.getState().notify("error", "The project needs a name: the old name is kept.", undefined, { topic: "project-name" });
                  return;
                }
                apply([{ type: "setMeta", field, value }], { undoable: true });
              }}
            />
          </div>
        </div>
      ))}
      <p className="field-note">{count} elements</p>
    </div>
  );
}

export function Inspector() {
  const doc = useDocumentStore((s) => s.doc);
  const apply = useDocumentStore((s) => s.applyChanges);
  const selection = useSessionStore((s) => s.selection);
  const messages = validationOf(doc);
  const selected = useMemo(() => selection.map((id) => doc.elements.find((e) => e.id === id)).filter((e): e is Element => !!e), [doc, selection]);
  const ids = selected.map((e) => e.id);
  const ctx: RowContext = useMemo(
    () => ({
      buses: doc.elements.filter((e) => e.kind === "bus"),
      elements: doc.elements,
      hosts: doc.elements.filter((e) => e.kind !== "bus" && !isProtectiveDevice(e)),
      readOnlyId: true,
      messageText: (m) => messageText(m, doc),
      messagesAt: (path) => messages.filter((m) => m.elementId !== undefined && ids.includes(m.elementId) && m.field === path),
      commit: (path, value) => {
        const changes: DocChange[] = ids.map((id) => ({ type: "setField", id, path, value }));
        try {
          apply(changes, { undoable: true });
        } catch (err) {
          useSessionStore.getState().notify("error", err instanceof Error ? err.message : String(err));
        }
      },
    }),
    [doc, messages, ids.join("|"), apply],
  );
  if (selected.length === 0) {
    return (
      <section className="inspector" aria-label="Properties">
        <h2 className="pane-title">Properties</h2>
        <ProjectFields />
      </section>
    );
  }
  const kinds = [...new Set(selected.map((e) => e.kind))];
  const specs = kinds.length === 1 ? fieldsOfKind(kinds[0]).filter((f) => selected.length === 1 || f.key !== "id") : commonSpecs(kinds);
  const general = messages.filter((m) => m.elementId !== undefined && ids.includes(m.elementId) && (!m.field || !specs.some((s) => m.field === s.key || m.field?.startsWith(s.key + "."))));
  const host = selected.length === 1 ? selected[0] : null;
  const overload = host ? overloadWarnings(doc, host) : [];
  const isBranch = host && (host.kind === "transformer" || host.kind === "line" || host.kind === "switch");
  return (
    <section className="inspector" aria-label="Properties">
      <h2 className="pane-title">Properties</h2>
      <div className="inspector-head" data-testid="inspector-head">
        {selected.length === 1 ? elementLabel(selected[0]) : `${selected.length} elements${kinds.length === 1 ? ` (${kindName(kinds[0]).toLowerCase()})` : ", shared fields"}`}
      </div>
      {overload.length > 0 && (
        <ul className="field-messages block" data-testid="overload-warning">
          {overload.map((text) => (
            <li key={text} className="msg msg-warning">
              {text}
            </li>
          ))}
        </ul>
      )}
      {general.length > 0 && (
        <ul className="field-messages block">
          {general.map((m, i) => (
            <li key={i} className={`msg msg-${m.severity}`}>
              {messageText(m, doc)}
            </li>
          ))}
        </ul>
      )}
      <div className="inspector-body">
        <FieldList specs={specs} values={selected} path={[]} ctx={ctx} />
        {host?.kind === "bus" && (
          <div className="field-row" data-field="layout.w">
            <label className="field-label" title="Length of the bar on the one-line (drawing only)">
              Bar length on the drawing
            </label>
            <div className="field-control">
              <input
                className="field-input num"
                aria-label="Bar length on the drawing"
                key={`${host.id}-${ownValue(doc.layout, host.id)?.w ?? DEFAULT_BUS_WIDTH}`}
                defaultValue={ownValue(doc.layout, host.id)?.w ?? DEFAULT_BUS_WIDTH}
                onKeyDown={(e) => e.key === "Enter" && e.currentTarget.blur()}
                onBlur={(e) => {
                  const w = Number(e.target.value);
                  const place = ownValue(doc.layout, host.id);
                  if (!(w >= 40 && w <= 5000) || !place || w === place.w) return;
                  apply([{ type: "moveNodes", places: { [host.id]: { ...place, w } } }], { undoable: true });
                }}
              />
              <span className="field-unit">px</span>
            </div>
          </div>
        )}
        {host && host.kind !== "bus" && !isProtectiveDevice(host) && (
          <fieldset className="field-group">
            <legend>Protection</legend>
            {(["relay", "fuse", "lvbreaker"] as const).map((kind) =>
              (isBranch ? [false, true] : [false]).map((lower) => (
                <button key={`${kind}-${lower}`} className="small-button" onClick={() => addElement(kind, { x: 0, y: 0 }, deviceLocationOn(host, lower))}>
                  + {kindName(kind)}
                  {isBranch ? (lower ? " (to end)" : " (from end)") : ""}
                </button>
              )),
            )}
          </fieldset>
        )}
      </div>
    </section>
  );
}
