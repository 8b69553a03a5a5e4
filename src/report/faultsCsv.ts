// faults.csv: one row per scenario, limit and bus; units in the header names.
import { csvTable } from "./csvTable.ts";
import type { FaultTable } from "./faultTable.ts";

export const FAULTS_CSV_HEADER = [
  "scenario_id",
  "scenario_name",
  "limit",
  "bus_id",
  "bus_name",
  "un_kV",
  "ikss_3ph_kA",
  "ikss_LL_kA",
  "ikss_LG_kA",
  "ikss_LLG_kA",
  "ip_3ph_kA",
  "xr_3ph",
] as const;

const r4 = (x: number) => Number(x.toFixed(4));

export function faultsCsv(table: FaultTable): string {
  return csvTable(
    FAULTS_CSV_HEADER,
    table.rows.map((r) => [
      r.scenario,
      r.scenarioName,
      r.limit,
      r.bus,
      r.busName,
      r.un_kV,
      r4(r.ikss_kA["3ph"]),
      r4(r.ikss_kA.LL),
      r4(r.ikss_kA.LG),
      r4(r.ikss_kA.LLG),
      r4(r.ip_kA),
      r4(r.xr),
    ]),
  );
}
