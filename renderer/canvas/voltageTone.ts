// One colour per voltage level, as CSS variables so both themes can tune them.
export type VoltageTone = "hv" | "mv" | "lv" | "none";

/** IEC 60038 bands: LV up to 1 kV, MV up to 35 kV, HV above. */
export function voltageTone(un_kV: number | undefined): VoltageTone {
  if (un_kV === undefined || !(un_kV > 0)) return "none";
  if (un_kV <= 1) return "lv";
  if (un_kV <= 35) return "mv";
  return "hv";
}

export function toneColor(tone: VoltageTone): string {
  return `var(--tone-${tone})`;
}
