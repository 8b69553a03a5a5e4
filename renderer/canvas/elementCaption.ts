// The short rating line printed beside an element on the one-line.
import type { Element } from "../../src/model/schema.ts";
import { fmt } from "./nodes/formatting.ts";
import { optionLabel } from "../../src/model/fieldLabels.ts";

export function elementCaption(e: Element): string {
  switch (e.kind) {
    case "transformer":
      return `${fmt(e.sr_MVA * 1000)} kVA · ${e.vectorGroup} · uk ${fmt(e.uk_pct)} %`;
    case "line":
      return `${fmt(e.length_km * 1000)} m · ${e.parallel > 1 ? `${e.parallel}× ` : ""}${fmt(e.csa_mm2)} mm² ${e.material}`;
    case "switch":
      return `${optionLabel("device", e.device).toLowerCase()}${e.closed ? "" : " · open"}`;
    case "grid":
      return `S"k ${fmt(e.skMax_MVA)}/${fmt(e.skMin_MVA)} MVA`;
    case "generator":
      return `${fmt(e.sr_MVA * 1000)} kVA · x"d ${fmt(e.xdss_pu)}`;
    case "inverter":
      return `${optionLabel("source", e.source)} ${fmt(e.sr_MVA * 1000)} kVA · ${optionLabel("control", e.control).toLowerCase()}`;
    case "motor":
      return `${fmt(e.pr_kW)} kW`;
    case "load":
      return `${fmt(e.p_kW)} kW / ${fmt(e.q_kvar)} kvar`;
    default:
      return "";
  }
}
