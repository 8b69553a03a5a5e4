// Fixed texts the UI, CLI and reports show beside protection results.
import { CAUTION_TEXT } from "../model/caution.ts";

/** Shown wherever settings, clearing times or withstand are displayed. */
export const PROTECTION_CAUTION = CAUTION_TEXT;

/** Fuse current limitation is not modelled. */
export const FUSE_LET_THROUGH_NOTE =
  "Fuse current limitation (cut-off current and let-through I2t) is not modelled: fuse curves give melting and total-clearing times only, at the prospective current.";

/** The parametric fuse families are our own formulas. */
export const FUSE_FAMILY_NOTE =
  "Parametric fuse families are illustrative curves from a generic formula, not any manufacturer's data; enter the fuse's published points for a real study.";
