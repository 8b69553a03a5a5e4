// Window title format from the project brief: "dairy-coop.islet • — Islet".
import { describe, expect, it } from "vitest";
import { documentTitle } from "../../../main/documentTitle.ts";

describe("window title", () => {
  it("shows the file name and a bullet for unsaved changes", () => {
    expect(documentTitle("dairy-coop.islet", true)).toBe("dairy-coop.islet • — Islet");
  });
  it("drops the bullet when saved", () => {
    expect(documentTitle("dairy-coop.islet", false)).toBe("dairy-coop.islet — Islet");
  });
  it("calls an unnamed document Untitled", () => {
    expect(documentTitle("  ", true)).toBe("Untitled • — Islet");
  });
});
