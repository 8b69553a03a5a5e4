// The protection study run from a command: its progress on the session's progress line (src/study's
// StudyHooks.onProgress), Ctrl+C seen between batches of cases (isCancelled, with the event loop given a turn).
import type { Project } from "../model/schema.ts";
import { StudyCancelled, type StudyHooks } from "../study/runStudy.ts";
import { studyProject } from "../study/studyProject.ts";
import { checkStudySize, StudyTooLarge } from "../study/studySize.ts";
import type { StudyOptions, StudyResult } from "../study/types.ts";
import type { CliSession } from "./session.ts";

const PHASES: Record<Parameters<NonNullable<StudyHooks["onProgress"]>>[2], string> = {
  cases: "fault cases",
  verdicts: "verdicts",
  timelines: "clearing timelines",
};

/**
 * Hooks that report the study's progress to the session and stop it at Ctrl+C. `prefix` names a sub-step;
 * `extra` adds the caller's own hooks (e.g. onScenario, to write each scenario out as it is done).
 */
export function studyHooks(session: CliSession, prefix = "", extra: Pick<StudyHooks, "onScenario"> = {}): StudyHooks {
  return {
    ...extra,
    onProgress: (done, total, phase) => session.progress.update(`${prefix}${PHASES[phase]}`, done, total),
    isCancelled: () => session.signal.aborted,
    yieldNow: session.yieldNow,
  };
}

/** The study, or null when Ctrl+C stopped it. */
export async function studyInSession(session: CliSession, project: Project, options: StudyOptions = {}, prefix = "", extra: Pick<StudyHooks, "onScenario"> = {}): Promise<StudyResult | null> {
  try {
    const result = await studyProject(project, options, studyHooks(session, prefix, extra));
    return session.signal.aborted ? null : result;
  } catch (err) {
    if (err instanceof StudyCancelled) return null;
    throw err;
  }
}

/** Exit code 2 after saying why, when the study would exceed the case budget (src/study/studySize.ts); null when it fits. */
export function refuseTooLarge(session: CliSession, project: Project, options: StudyOptions = {}): number | null {
  try {
    checkStudySize(project, options);
    return null;
  } catch (err) {
    if (!(err instanceof StudyTooLarge)) throw err;
    session.out.error(`islet ${session.name}: ${err.message}`);
    return 2;
  }
}
