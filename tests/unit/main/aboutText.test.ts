// The About box carries the project's caution wording (project rules) and the versions.
import { describe, expect, it } from "vitest";
import { aboutText } from "../../../main/aboutText.ts";

describe("About box", () => {
  it("carries the caution text word for word", () => {
    const { detail } = aboutText("0.1.0", { electron: "41.0.0", chrome: "140", node: "22" });
    // project rules: the exact caution sentence
    expect(detail).toContain("Results support, and do not replace, review by a licensed engineer under local codes and the utility's interconnection rules.");
  });
  it("names the app version", () => {
    expect(aboutText("1.2.3", { electron: "e", chrome: "c", node: "n" }).message).toBe("Islet 1.2.3");
  });
});
