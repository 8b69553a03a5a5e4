// Text of the About box. The caution is the project's standard wording.
import { STUDY_CAUTION } from "../src/study/types.ts";
import { APP_NAME } from "./documentTitle.ts";

export function aboutText(version: string, runtime: { electron: string; chrome: string; node: string }): { message: string; detail: string } {
  return {
    message: `${APP_NAME} ${version}`,
    detail: [
      "A desktop protection studio for microgrids: short-circuit currents, protective-device coordination, blinding and sympathetic-tripping checks, study reports.",
      "",
      STUDY_CAUTION,
      "",
      `Electron ${runtime.electron}, Chromium ${runtime.chrome}, Node.js ${runtime.node}`,
    ].join("\n"),
  };
}
