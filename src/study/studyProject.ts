// The study's entry for a whole project: binds the engine and the device models and runs the study.
import type { Project } from "../model/schema.ts";
import { engineSolver } from "./engineSolver.ts";
import { protectionModel } from "./protectionModel.ts";
import { runStudy, type StudyHooks } from "./runStudy.ts";
import type { StudyOptions, StudyResult } from "./types.ts";

export async function studyProject(project: Project, options: StudyOptions = {}, hooks: StudyHooks = {}): Promise<StudyResult> {
  const warnings: string[] = [];
  const model = protectionModel((w) => warnings.push(w));
  const result = await runStudy(project, { solver: engineSolver(project), model }, options, hooks);
  result.warnings.push(...warnings.filter((w) => !result.warnings.includes(w)));
  return result;
}
