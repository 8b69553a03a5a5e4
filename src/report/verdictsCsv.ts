// verdicts.csv: every verdict (passed ones included) with its reference, case, explanation and numbers.
import type { Verdict } from "../study/types.ts";
import { csvTable } from "./csvTable.ts";

export const VERDICTS_CSV_HEADER = ["ref", "status", "check", "scenario_id", "case_id", "device_id", "other_id", "explanation", "numbers"] as const;

export function verdictsCsv(verdicts: readonly Verdict[], refs: ReadonlyMap<string, string>): string {
  return csvTable(
    VERDICTS_CSV_HEADER,
    verdicts.map((v) => [
      refs.get(v.id) ?? "",
      v.status,
      v.kind,
      v.scenario,
      v.caseId ?? "",
      v.device,
      v.other ?? "",
      v.explanation,
      Object.entries(v.numbers)
        .map(([k, x]) => `${k}=${x}`)
        .join("; "),
    ]),
  );
}
