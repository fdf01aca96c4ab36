import { cn } from "@/components/ui/cn";

const tones: Record<string, string> = {
  sound: "bg-emerald-100 text-emerald-900",
  worn: "bg-sky-100 text-sky-900",
  needs_repair: "bg-amber-100 text-amber-900",
  in_repair: "bg-orange-100 text-orange-900",
  retired: "bg-stone-200 text-stone-700",
};

/** The condition as a coloured pill; the label comes translated from the caller. */
export function ConditionBadge({ condition, label, className }: { condition: string; label: string; className?: string }) {
  return (
    <span data-condition={condition} className={cn("inline-flex items-center whitespace-nowrap rounded-full px-2 py-0.5 text-xs font-medium", tones[condition], className)}>
      {label}
    </span>
  );
}

export function OutBadge({ label, overdue }: { label: string; overdue?: boolean }) {
  return (
    <span className={cn("inline-flex w-fit items-center whitespace-nowrap rounded-full px-2 py-0.5 text-xs font-medium", overdue ? "bg-red-100 text-red-900" : "bg-ink-100 text-ink-800")}>
      {label}
    </span>
  );
}
