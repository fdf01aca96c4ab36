"use client";

// A run's quality findings on its page: the list, the photos, and the form that records one.
import type { RunDto } from "@/lib/contracts/runs";
import type { RunAbilities } from "./stage-work";

export function RunFindings(_props: { run: RunDto; can: RunAbilities }) {
  return null;
}
