// One inspector field with its unit, its validation messages beside it, and commit on Enter/blur.
import { useEffect, useState, type ReactNode } from "react";
import type { Element } from "../../src/model/schema.ts";
import type { Message } from "../../src/model/messages.ts";
import type { FieldSpec } from "./fieldModel.ts";
import { optionLabel } from "../../src/model/fieldLabels.ts";

export const MIXED = Symbol("mixed");
export type FieldValue = unknown | typeof MIXED;

export interface RowContext {
  buses: Element[];
  /** Every element of the document, for choosers of a referenced element (elementRef fields). */
  elements: Element[];
  hosts: Element[];
  messagesAt(path: string): Message[];
  /** A message as shown: field labels in place of keys. */
  messageText(m: Message): string;
  commit(path: (string | number)[], value: unknown): void;
  readOnlyId: boolean;
}

function Messages({ list, text }: { list: Message[]; text(m: Message): string }) {
  if (list.length === 0) return null;
  return (
    <ul className="field-messages">
      {list.map((m, i) => (
        <li key={i} className={`msg msg-${m.severity}`} data-testid="field-message">
          {text(m)}
        </li>
      ))}
    </ul>
  );
}

function NumberInput({ value, optional, onCommit, label }: { value: FieldValue; optional: boolean; onCommit(v: number | undefined): void; label: string }) {
  const shown = value === MIXED ? "" : typeof value === "number" ? String(value) : "";
  const [draft, setDraft] = useState(shown);
  const [bad, setBad] = useState<string | null>(null);
  useEffect(() => {
    setDraft(shown);
    setBad(null);
  }, [shown]);
  const commit = () => {
    const text = draft.trim().replace(",", ".");
    if (text === shown) return;
    if (text === "") {
      if (optional) onCommit(undefined);
      else if (value !== MIXED) setBad("A value is required");
      return;
    }
    const n = Number(text);
    if (!Number.isFinite(n)) {
      setBad(`"${draft}" is not a number`);
      return;
    }
    setBad(null);
    onCommit(n);
  };
  return (
    <>
      <input
        className={`field-input num${bad ? " is-bad" : ""}`}
        inputMode="decimal"
        aria-label={label}
        value={draft}
        placeholder={value === MIXED ? "mixed" : optional ? "not set" : ""}
        onChange={(e) => setDraft(e.target.value)}
        onBlur={commit}
        onKeyDown={(e) => {
          if (e.key === "Enter") commit();
          if (e.key === "Escape") setDraft(shown);
        }}
      />
      {bad && <span className="msg msg-error">{bad}</span>}
    </>
  );
}

export function TextInput({ value, onCommit, label, readOnly }: { value: FieldValue; onCommit(v: string): void; label: string; readOnly: boolean }) {
  const shown = value === MIXED ? "" : typeof value === "string" ? value : "";
  const [draft, setDraft] = useState(shown);
  useEffect(() => setDraft(shown), [shown]);
  return (
    <input
      className="field-input"
      aria-label={label}
      value={draft}
      readOnly={readOnly}
      placeholder={value === MIXED ? "mixed" : ""}
      onChange={(e) => setDraft(e.target.value)}
      onBlur={() => draft !== shown && onCommit(draft)}
      onKeyDown={(e) => e.key === "Enter" && draft !== shown && onCommit(draft)}
    />
  );
}

export function Row({ spec, path, value, ctx, children }: { spec: FieldSpec; path: (string | number)[]; value: FieldValue; ctx: RowContext; children?: ReactNode }) {
  const pathText = path.join(".");
  const msgs = ctx.messagesAt(pathText);
  let control: ReactNode;
  switch (spec.type) {
    case "number":
      control = <NumberInput label={spec.label} value={value} optional={spec.optional} onCommit={(v) => ctx.commit(path, v)} />;
      break;
    case "text":
      control = <TextInput label={spec.label} value={value} readOnly={spec.key === "id" && ctx.readOnlyId} onCommit={(v) => ctx.commit(path, spec.optional && v === "" ? undefined : v)} />;
      break;
    case "busRef":
      control = (
        <select className="field-input" aria-label={spec.label} value={value === MIXED ? "" : String(value ?? "")} onChange={(e) => ctx.commit(path, e.target.value)}>
          {value === MIXED && <option value="">mixed</option>}
          <option value="">not connected</option>
          {ctx.buses.map((b) => (
            <option key={b.id} value={b.id}>
              {b.name ? `${b.name} (${b.id})` : b.id}
            </option>
          ))}
        </select>
      );
      break;
    case "elementRef": {
      const choices = ctx.elements.filter((e) => e.kind === spec.kind);
      const known = value === MIXED || value === undefined || value === "" || choices.some((e) => e.id === value);
      control = (
        <select className="field-input" aria-label={spec.label} value={value === MIXED ? "" : String(value ?? "")} onChange={(e) => ctx.commit(path, e.target.value)}>
          {value === MIXED && <option value="">mixed</option>}
          <option value="">none chosen</option>
          {!known && <option value={String(value)}>{`${String(value)} (not a ${spec.kind})`}</option>}
          {choices.map((e) => (
            <option key={e.id} value={e.id}>
              {e.name ? `${e.name} (${e.id})` : e.id}
            </option>
          ))}
        </select>
      );
      break;
    }
    case "choice":
      control = (
        <select
          className="field-input"
          aria-label={spec.label}
          value={value === MIXED || value === undefined ? "" : String(value)}
          onChange={(e) => {
            const raw = e.target.value;
            const picked = spec.options.find((o) => String(o) === raw);
            ctx.commit(path, raw === "" ? undefined : picked);
          }}
        >
          {(value === MIXED || value === undefined) && <option value="">{value === MIXED ? "mixed" : "not set"}</option>}
          {spec.options.map((o) => (
            <option key={String(o)} value={String(o)}>
              {optionLabel(spec.key, o)}
            </option>
          ))}
        </select>
      );
      break;
    case "flag":
      control = <input type="checkbox" aria-label={spec.label} checked={value === true} ref={(el) => {
        if (el) el.indeterminate = value === MIXED;
      }} onChange={(e) => ctx.commit(path, e.target.checked)} />;
      break;
    default:
      control = children;
  }
  return (
    <div className={`field-row${msgs.some((m) => m.severity === "error") ? " has-error" : ""}`} data-field={pathText}>
      <label className="field-label" title={spec.help}>
        {spec.label}
      </label>
      <div className="field-control">
        {control}
        {spec.type === "number" && spec.unit && <span className="field-unit">{spec.unit}</span>}
      </div>
      <Messages list={msgs} text={ctx.messageText} />
    </div>
  );
}
