// The caution every report carries on its cover and in the footer of every page.
import { CAUTION_TEXT } from "../model/caution.ts";
export const REPORT_CAUTION = CAUTION_TEXT;
