// The caution every report carries on its cover and in the footer of every page.
export const REPORT_CAUTION =
  "Results support, and do not replace, review by a licensed engineer under local codes and the utility's interconnection rules.";
