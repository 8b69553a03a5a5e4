// Renders a list of field specs against a value (or several values: "mixed" where they differ),
// recursing into groups, lists (relay functions), variants (fuse curves) and device locations.
import { fieldApplies, type FieldSpec } from "./fieldModel.ts";
import { Row, MIXED, type FieldValue, type RowContext } from "./FieldRow.tsx";
import { relayFunctionSchema } from "../../src/model/schema.ts";
import { optionLabel } from "../../src/model/fieldLabels.ts";

/** Starting values when the user adds an optional group; all generic round figures. */
const GROUP_STARTS: Record<string, Record<string, unknown>> = {
  shortTime: { isd_x: 6, tsd_s: 0.1, i2t: false },
  instantaneous: { ii_x: 10 },
  groundFault: { ig_A: 100, tg_s: 0.2, i2t: false },
  restraint: { vFull_pu: 0.9, kMin: 0.25 },
  unit: { transformer: "", onLoadTap: true, pG_pct: 0 },
};

function pick(values: unknown[], key: string | number): FieldValue {
  const vs = values.map((v) => (v && typeof v === "object" ? (v as Record<string | number, unknown>)[key] : undefined));
  const first = JSON.stringify(vs[0]);
  return vs.every((v) => JSON.stringify(v) === first) ? vs[0] : MIXED;
}

interface Props {
  specs: FieldSpec[];
  /** One value per selected element at this path. */
  values: unknown[];
  path: (string | number)[];
  ctx: RowContext;
}

export function FieldList({ specs, values, path, ctx }: Props) {
  return (
    <>
      {specs.map((spec) => {
        if (!fieldApplies(spec.key, values)) return null;
        const p = [...path, spec.key];
        const value = pick(values, spec.key);
        if (spec.type === "group") {
          const absent = value === undefined;
          return (
            <fieldset key={spec.key} className="field-group" data-field={p.join(".")}>
              <legend title={spec.help}>
                {spec.label}
                {spec.optional && !absent && value !== MIXED && (
                  <button className="link-button" onClick={() => ctx.commit(p, undefined)}>
                    remove
                  </button>
                )}
              </legend>
              {absent ? (
                spec.optional && (
                  <button className="small-button" onClick={() => ctx.commit(p, GROUP_STARTS[spec.key] ?? {})}>
                    Add
                  </button>
                )
              ) : value === MIXED ? (
                <FieldList specs={spec.fields} values={values.map((v) => (v as Record<string, unknown>)?.[spec.key])} path={p} ctx={ctx} />
              ) : (
                <FieldList specs={spec.fields} values={[value]} path={p} ctx={ctx} />
              )}
            </fieldset>
          );
        }
        if (spec.type === "list") {
          if (value === MIXED || !Array.isArray(value)) return <p key={spec.key} className="field-note">{spec.label}: differ between the selected elements</p>;
          return (
            <fieldset key={spec.key} className="field-group" data-field={p.join(".")}>
              <legend>{spec.label}</legend>
              {value.map((item, i) => (
                <fieldset key={i} className="field-group nested" data-field={`${p.join(".")}.${i}`}>
                  <legend>
                    {optionLabel("ansi", String((item as Record<string, unknown>).ansi ?? i + 1))} · {String((item as Record<string, unknown>).id ?? "")}
                    <button className="link-button" onClick={() => ctx.commit(p, value.filter((_, j) => j !== i))}>
                      remove
                    </button>
                  </legend>
                  <FieldList specs={spec.item} values={[item]} path={[...p, i]} ctx={ctx} />
                </fieldset>
              ))}
              {spec.key === "functions" && (
                <button
                  className="small-button"
                  onClick={() => {
                    const ids = new Set(value.map((f) => (f as { id: string }).id));
                    let n = value.length + 1;
                    while (ids.has(`f${n}`)) n++;
                    const added = relayFunctionSchema.parse({ id: `f${n}`, ansi: "50", quantity: "phase", curve: "definite-time", pickup_A: 1000, delay_s: 0.05 });
                    ctx.commit(p, [...value, added]);
                  }}
                >
                  Add function
                </button>
              )}
            </fieldset>
          );
        }
        if (spec.type === "variant") {
          const tag = value !== MIXED && value && typeof value === "object" ? String((value as Record<string, unknown>)[spec.discriminator]) : "";
          return (
            <fieldset key={spec.key} className="field-group" data-field={p.join(".")}>
              <legend>{spec.label}</legend>
              <Row spec={{ type: "choice", key: spec.discriminator, label: "Curve form", help: spec.help, options: Object.keys(spec.variants), optional: false }} path={[...p, spec.discriminator]} value={tag || MIXED} ctx={{ ...ctx, commit: (_path, v) => ctx.commit(p, v === "parametric" ? { kind: "parametric", family: "general-purpose" } : { kind: v, melt: [[200, 10], [2000, 0.01]], clear: [[220, 10], [2200, 0.01]] }) }} />
              {tag === "parametric" && <FieldList specs={spec.variants[tag]} values={[value]} path={p} ctx={ctx} />}
              {tag === "points" && <p className="field-note">{((value as { melt?: unknown[] }).melt ?? []).length} melting points; edit the points in the project file.</p>}
            </fieldset>
          );
        }
        if (spec.type === "location") {
          const at = value !== MIXED ? (value as { element?: string; end?: string } | undefined) : undefined;
          const host = ctx.hosts.find((h) => h.id === at?.element);
          const branch = host && (host.kind === "transformer" || host.kind === "line" || host.kind === "switch");
          return (
            <Row key={spec.key} spec={spec} path={p} value={value} ctx={ctx}>
              <select className="field-input" aria-label="Located at element" value={at?.element ?? ""} onChange={(e) => {
                const h = ctx.hosts.find((x) => x.id === e.target.value);
                if (!h) return;
                const isBranch = h.kind === "transformer" || h.kind === "line" || h.kind === "switch";
                ctx.commit(p, { element: h.id, end: isBranch ? "from" : "terminal" });
              }}>
                {value === MIXED && <option value="">mixed</option>}
                {ctx.hosts.map((h) => (
                  <option key={h.id} value={h.id}>
                    {h.name ? `${h.name} (${h.id})` : h.id}
                  </option>
                ))}
              </select>
              {branch && (
                <select className="field-input" aria-label="End" value={at?.end ?? "from"} onChange={(e) => ctx.commit([...p, "end"], e.target.value)}>
                  <option value="from">{host?.kind === "transformer" ? "from end (HV)" : "from end"}</option>
                  <option value="to">{host?.kind === "transformer" ? "to end (LV)" : "to end"}</option>
                </select>
              )}
            </Row>
          );
        }
        return <Row key={spec.key} spec={spec} path={p} value={value} ctx={ctx} />;
      })}
    </>
  );
}
