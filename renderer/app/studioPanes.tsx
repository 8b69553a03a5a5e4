// The lower panes built as separate components (chain, time-current, verdicts), wired to the
// studio's stores here.
import type { PaneEntry } from "./BottomPanes.tsx";
import { ChainPane } from "../panes/chain/index.ts";
import { VerdictPane } from "../panes/verdicts/index.ts";
import { TimeCurrentView } from "../analysis/TimeCurrentView.tsx";
import { useStudyStore } from "../fault/studyStore.ts";
import { useSessionStore } from "../store/sessionStore.ts";
import { selectCase } from "../fault/studyCommands.ts";
import { useCallback } from "react";
import type { MatrixRow } from "../../src/study/types.ts";
import { useDocumentStore } from "../store/documentStore.ts";
import { rowCaption, rowGroupByName, rowLabelByName } from "./caseNames.ts";

function ChainView() {
  const { caseResult, caseVerdicts, caseError } = useStudyStore();
  const selection = useSessionStore((s) => s.selection);
  const doc = useDocumentStore((s) => s.doc);
  const nameOf = useCallback((id: string) => doc.elements.find((e) => e.id === id)?.name || id, [doc]);
  if (caseError) return <p className="pane-empty msg-error">{caseError}</p>;
  return (
    <ChainPane
      chains={caseResult?.chains ?? null}
      caseLabel={caseResult?.faultCase.label}
      responses={caseResult?.responses}
      verdicts={caseVerdicts}
      selectedDeviceId={selection[0] ?? null}
      onStepChange={(deviceId) => {
        const st = useSessionStore.getState();
        // select the step's device and bring it into view on the one-line
        st.set({ selection: [deviceId], follow: { device: deviceId, seq: (st.follow?.seq ?? 0) + 1 } });
      }}
      operation={caseResult?.operation ?? null}
      nameOf={nameOf}
    />
  );
}

function VerdictView() {
  const { full, caseResult } = useStudyStore();
  const doc = useDocumentStore((s) => s.doc);
  // names, with the id beside them; stable per document so the pane's grouping memo holds
  const labelOfRow = useCallback((row: MatrixRow) => rowLabelByName(doc, row), [doc]);
  const groupOfRow = useCallback((row: MatrixRow) => rowGroupByName(doc, row), [doc]);
  return (
    <VerdictPane
      matrix={full?.matrix ?? null}
      verdicts={full?.verdicts ?? []}
      selectedCaseId={caseResult?.faultCase.id ?? null}
      onSelectCase={selectCase}
      labelOfRow={labelOfRow}
      captionOfRow={rowCaption}
      groupOfRow={groupOfRow}
    />
  );
}

export function studioPanes(): PaneEntry[] {
  return [
    { id: "chain", title: "Operation", render: () => <ChainView /> },
    { id: "tcc", title: "Time-current", render: () => <TimeCurrentView /> },
    { id: "verdicts", title: "Verdicts", render: () => <VerdictView /> },
  ];
}
