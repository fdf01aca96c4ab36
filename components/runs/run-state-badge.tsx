import { useTranslations } from "next-intl";
import { cn } from "@/components/ui/cn";
import type { RunState } from "@/lib/contracts/runs";

const tones: Record<RunState, string> = {
  setup: "bg-sky-100 text-sky-900",
  underway: "bg-amber-100 text-amber-900",
  complete: "bg-emerald-100 text-emerald-900",
  halted: "bg-stone-200 text-stone-700",
};

/** A run's state as a coloured pill (works in server and client components). */
export function RunStateBadge({ state, className }: { state: RunState; className?: string }) {
  const t = useTranslations("runs.state");
  return (
    <span data-state={state} className={cn("inline-flex items-center whitespace-nowrap rounded-full px-2 py-0.5 text-xs font-medium", tones[state], className)}>
      {t(state)}
    </span>
  );
}
