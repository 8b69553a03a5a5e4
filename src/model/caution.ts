// The one caution sentence Islet shows wherever results can hurt someone (settings, clearing times,
// withstand): in the studio's status area, the CLI, every export and every report page.
export const CAUTION_TEXT =
  "Results support, and do not replace, review by a licensed engineer under local codes and the utility's interconnection rules.";
