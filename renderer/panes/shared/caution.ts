// The caution every output that shows settings or clearing times carries (project rule).
export const CAUTION_TEXT =
  "Results support, and do not replace, review by a licensed engineer under local codes and the utility's interconnection rules.";
