// The studio's report assembly: the demo's HTML report names the project, carries the caution and
// the SHA-256 of the project text, computed here independently with node:crypto.
import { beforeAll, describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { loadProject, serializeProject } from "../../../src/model/projectFile.ts";
import type { Project } from "../../../src/model/schema.ts";
import { studyProject } from "../../../src/study/studyProject.ts";
import type { StudyResult } from "../../../src/study/types.ts";
import { REPORT_CAUTION, failureTimelineCases } from "../../../src/report/index.ts";
import { reportBaseName, reportCommand, sha256Hex } from "../../../renderer/files/reportCommand.ts";
import { failureTimelines, setStudyClient } from "../../../renderer/fault/studyCommands.ts";
import { studyClient } from "../../../renderer/worker/studyClient.ts";
import { mainThreadPort } from "../../../renderer/worker/studioWorker.ts";

const demoText = readFileSync(fileURLToPath(new URL("../../../assets/demo/dairy-coop.islet", import.meta.url)), "utf8");
let project: Project;
let study: StudyResult;

beforeAll(async () => {
  const loaded = loadProject(demoText);
  if (!loaded.ok) throw new Error(loaded.error.messages.join("\n"));
  project = loaded.project;
  study = await studyProject(project);
}, 240_000);

describe("sha256Hex", () => {
  it("gives the FIPS 180-2 digest of \"abc\"", async () => {
    // FIPS 180-2, Appendix B.1 (SHA-256 of "abc")
    expect(await sha256Hex("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });
});

describe("reportBaseName", () => {
  it("uses the file's stem, else the project name made file-safe", () => {
    expect(reportBaseName("dairy-coop.islet", "Dairy")).toBe("dairy-coop");
    expect(reportBaseName(null, "Dairy co-op / north")).toBe("Dairy-co-op-north");
    expect(reportBaseName(null, "///")).toBe("project");
  });
});

describe("reportCommand", () => {
  it("builds an HTML report with the project name, the caution and the project text's SHA-256", async () => {
    const out = await reportCommand({ project, study, fileName: "dairy-coop.islet", dirty: false, date: "2026-12-02", version: "9.9.9-test" });
    // independent hash of the same serialized text with node:crypto
    const expected = createHash("sha256").update(serializeProject(project), "utf8").digest("hex");
    expect(out.fileSha256).toBe(expected);
    expect(out.html).toContain(expected);
    expect(out.html).toContain(REPORT_CAUTION);
    expect(REPORT_CAUTION).toContain("Results support, and do not replace, review by a licensed engineer under local codes and the utility's interconnection rules.");
    const escapedName = project.meta.name.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#39;");
    expect(out.html).toContain(escapedName);
    expect(out.html).toContain("2026-12-02");
    expect(out.html).toContain("9.9.9-test");
    expect(out.htmlName).toBe("dairy-coop-report.html");
    expect(out.pdfName).toBe("dairy-coop-report.pdf");
  });

  it("says when the hash is of a document never saved or changed since its save", async () => {
    const unsaved = await reportCommand({ project, study, fileName: null, dirty: true, date: "2026-12-02", version: "1" });
    expect(unsaved.html).toContain("not saved to a file (hash of the current document)");
    const changed = await reportCommand({ project, study, fileName: "dairy-coop.islet", dirty: true, date: "2026-12-02", version: "1" });
    expect(changed.html).toContain("dairy-coop.islet, with unsaved changes (hash of the current document)");
  });

  it("adds the clearing timelines of the worst failed cases the full study did not simulate, as the CLI's report does", async () => {
    setStudyClient(studyClient(mainThreadPort()));
    const wanted = failureTimelineCases(study);
    expect(wanted.length).toBeGreaterThan(0);
    const extra = await failureTimelines(project, study);
    expect(extra.map((t) => t.caseId)).toEqual(wanted.map((w) => w.caseId));
    // a failed case either shows what operated or says that nothing did and the fault stayed fed
    for (const t of extra) expect(t.events.length > 0 || (!t.isolated && /nothing operates/.test(t.summary))).toBe(true);
    expect(extra.some((t) => t.events.length > 0)).toBe(true);
    const out = await reportCommand({ project, study, extraTimelines: extra, fileName: "dairy-coop.islet", dirty: false, date: "2026-12-02", version: "1" });
    const plain = await reportCommand({ project, study, fileName: "dairy-coop.islet", dirty: false, date: "2026-12-02", version: "1" });
    const section = (html: string) => html.slice(html.indexOf('id="timelines"'), html.indexOf('id="open-items"'));
    const blocks = (html: string) => [...section(html).matchAll(/<div class="timeline-block">/g)].length;
    expect(blocks(out.html)).toBe(blocks(plain.html) + extra.length);
    const label = (id: string) => study.cases.find((c) => c.faultCase.id === id)!.faultCase.label.replace(/&/g, "&amp;").replace(/'/g, "&#39;").replace(/"/g, "&quot;");
    for (const t of extra) expect(section(out.html)).toContain(`<h3>${label(t.caseId)}</h3>`);
  }, 120_000);
});
