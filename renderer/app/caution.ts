// The caution shown wherever results can hurt someone (settings, clearing times, withstand).
export { CAUTION_TEXT } from "../../src/model/caution.ts";
