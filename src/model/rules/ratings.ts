// Plausibility of single records beyond what the schema can say on its own.
import { errorMessage, warningMessage, type Message } from "../messages.ts";
import { fmt, type RuleContext } from "./ruleContext.ts";

export function ratings(ctx: RuleContext): Message[] {
  const out: Message[] = [];
  for (const e of ctx.project.elements) {
    const label = ctx.label(e);
    if (e.kind === "grid" && e.skMin_MVA > e.skMax_MVA) {
      out.push(errorMessage(`${label}: skMin_MVA ${fmt(e.skMin_MVA)} must be <= skMax_MVA ${fmt(e.skMax_MVA)}`, e.id, "skMin_MVA"));
    }
    if (e.kind === "transformer" && e.ur_pct >= e.uk_pct) {
      out.push(errorMessage(`${label}: ur_pct ${fmt(e.ur_pct)} must be < uk_pct ${fmt(e.uk_pct)} (the resistive part of the short-circuit voltage)`, e.id, "ur_pct"));
    }
    if (e.kind === "relay") {
      if (e.functions.length > 0 && e.functions.every((f) => !f.enabled)) {
        out.push(warningMessage(`${label}: every function is disabled, so the relay never trips`, e.id, "functions"));
      }
      if (e.functions.length === 0) out.push(warningMessage(`${label}: functions is empty, so the relay never trips`, e.id, "functions"));
      e.functions.forEach((f, k) => {
        if (f.tMax_s !== undefined && f.tMax_s < f.tMin_s) {
          out.push(errorMessage(`${label}: functions.${k}.tMax_s ${fmt(f.tMax_s)} must be >= tMin_s ${fmt(f.tMin_s)} (function "${f.id}")`, e.id, `functions.${k}.tMax_s`));
        }
        if (f.quantity === "phase" && (f.ansi === "51N" || f.ansi === "50N")) {
          out.push(warningMessage(`${label}: functions.${k}.quantity is "phase" but ansi ${f.ansi} is a residual (earth-fault) element (function "${f.id}")`, e.id, `functions.${k}.quantity`));
        }
      });
    }
    if (e.kind === "lvbreaker" && e.shortTime && e.instantaneous) {
      const isd_A = e.shortTime.isd_x * e.longTime.ir_x * e.in_A;
      const ii_A = e.instantaneous.ii_x * e.in_A;
      if (ii_A < isd_A) {
        out.push(warningMessage(`${label}: instantaneous.ii_x gives ${fmt(ii_A)} A, below the short-time pickup ${fmt(isd_A)} A, so the short-time band never acts`, e.id, "instantaneous.ii_x"));
      }
    }
    if (e.kind === "fuse" && e.curve.kind === "points") {
      for (const part of ["melt", "clear"] as const) {
        const pts = e.curve[part];
        for (let k = 1; k < pts.length; k++) {
          if (!(pts[k][0] > pts[k - 1][0] && pts[k][1] <= pts[k - 1][1])) {
            out.push(errorMessage(`${label}: curve.${part}.${k} must have more current and no more time than the point before it`, e.id, `curve.${part}.${k}`));
            break;
          }
        }
      }
    }
  }
  return out;
}
