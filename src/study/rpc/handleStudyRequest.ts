// The study worker's request handler: plain data in and out, pure apart from the callbacks passed in.
// A full study reports progress and checks the cancellation signal between cases; a case request
// returns one fault case's device responses and chains (and optionally its clearing timeline).
import { loadProject } from "../../model/projectFile.ts";
import { projectSchema, type Project } from "../../model/schema.ts";
import { runStudy, StudyCancelled } from "../runStudy.ts";
import { checkStudySize } from "../studySize.ts";
import { locationKey } from "../keys.ts";
import { engineSolver } from "../engineSolver.ts";
import { protectionModel } from "../protectionModel.ts";
import { enumerateFaultCases } from "../faultCases.ts";
import type { StudyProgress, StudyRequest, StudyResponse } from "../types.ts";

export interface StudyRequestContext {
  onProgress?: (p: StudyProgress) => void;
  /** A cancellation signal (AbortSignal-like); checked between cases. */
  signal?: { readonly aborted: boolean };
  /** Lets the worker read its messages between batches of cases. */
  yieldNow?: () => Promise<void>;
}

function readProject(input: unknown): { ok: true; project: Project } | { ok: false; message: string } {
  if (typeof input === "string") {
    const r = loadProject(input);
    return r.ok ? { ok: true, project: r.project } : { ok: false, message: r.error.messages.join("\n") };
  }
  const parsed = projectSchema.safeParse(input);
  if (parsed.success) return { ok: true, project: parsed.data };
  return { ok: false, message: `Project: ${parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ")}` };
}

export async function handleStudyRequest(request: StudyRequest, ctx: StudyRequestContext = {}): Promise<StudyResponse> {
  const { requestId } = request;
  const read = readProject(request.project);
  if (!read.ok) return { kind: "error", requestId, ok: false, message: read.message };
  const project = read.project;
  try {
    if (request.kind === "full") {
      // a study too large for the budget is refused with its numbers (the message reaches the studio)
      checkStudySize(project, request.options ?? {});
      const result = await runStudy(
        project,
        { solver: engineSolver(project), model: protectionModel() },
        request.options ?? {},
        {
          onProgress: (done, total, phase) => ctx.onProgress?.({ requestId, done, total, phase }),
          isCancelled: () => ctx.signal?.aborted === true,
          yieldNow: ctx.yieldNow,
        },
      );
      return { kind: "full", requestId, ok: true, result };
    }
    const fc = enumerateFaultCases(project).find((c) => c.id === request.caseId);
    if (!fc) return { kind: "error", requestId, ok: false, message: `Fault case ${request.caseId}: not found in this project` };
    // the same pipeline and verdict kinds as the full study, on this one location, type and limit
    const one = await runStudy(
      project,
      { solver: engineSolver(project), model: protectionModel() },
      { scenarios: [fc.scenario], faultTypes: [fc.faultType], limits: [fc.limit], locationKeys: [locationKey(fc.location)], timelineCases: request.timeline ? [fc.id] : [] },
    );
    const result = one.cases.find((c) => c.faultCase.id === fc.id);
    if (!result) return { kind: "error", requestId, ok: false, message: `Fault case ${request.caseId}: could not be studied` };
    const ids = new Set(result.verdictIds);
    const timeline = request.timeline ? (one.timelines.find((t) => t.caseId === fc.id) ?? null) : null;
    return { kind: "case", requestId, ok: true, result, verdicts: one.verdicts.filter((v) => ids.has(v.id)), timeline };
  } catch (err) {
    if (err instanceof StudyCancelled) return { kind: "cancelled", requestId, ok: false };
    return { kind: "error", requestId, ok: false, message: err instanceof Error ? err.message : String(err) };
  }
}
