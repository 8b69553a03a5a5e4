// The caution every output that shows settings or clearing times carries (project rule).
export { CAUTION_TEXT } from "../../../src/model/caution.ts";
