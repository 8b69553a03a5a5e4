// The caution shown wherever results can hurt someone (settings, clearing times, withstand).
export const CAUTION_TEXT =
  "Results support, and do not replace, review by a licensed engineer under local codes and the utility's interconnection rules.";
