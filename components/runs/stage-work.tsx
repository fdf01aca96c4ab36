"use client";

// A stage's work on the run page: its progress, pot readings and boil-off records, and the forms that add them
// (the stage's own records only; findings are the run's, in run-findings.tsx).
import type { RunDto, RunStageDto } from "@/lib/contracts/runs";
import type { UnitSystem } from "@/lib/contracts/wax";

export interface RunAbilities {
  write: boolean;
  recordWaxing: boolean;
  recordFindings: boolean;
}

export function StageWork(_props: { run: RunDto; stage: RunStageDto; can: RunAbilities; unitSystem: UnitSystem }) {
  return null;
}
