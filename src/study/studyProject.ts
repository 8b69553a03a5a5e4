// The study's entry for a whole project: binds the engine and the device models and runs the study.
import type { Project } from "../model/schema.ts";
import { engineSolver } from "./engineSolver.ts";
import { protectionModel } from "./protectionModel.ts";
import { runStudy, type StudyHooks } from "./runStudy.ts";
import type { StudyOptions, StudyResult } from "./types.ts";
import { checkStudySize, STUDY_CASE_BUDGET } from "./studySize.ts";

/** Runs the study; refuses (StudyTooLarge, with the numbers) one that would exceed the case budget. */
export async function studyProject(project: Project, options: StudyOptions = {}, hooks: StudyHooks = {}, budget = STUDY_CASE_BUDGET): Promise<StudyResult> {
  checkStudySize(project, options, budget);
  const warnings: string[] = [];
  const model = protectionModel((w) => warnings.push(w));
  const result = await runStudy(project, { solver: engineSolver(project), model }, options, hooks);
  result.warnings.push(...warnings.filter((w) => !result.warnings.includes(w)));
  return result;
}
