import { cn } from "./cn";

const tones = {
  info: "border-ink-200 bg-ink-50 text-ink-800",
  success: "border-emerald-200 bg-emerald-50 text-emerald-900",
  error: "border-red-200 bg-red-50 text-red-900",
  warning: "border-amber-200 bg-amber-50 text-amber-900",
};

export function Notice({ tone = "info", children, className }: { tone?: keyof typeof tones; children: React.ReactNode; className?: string }) {
  return (
    <div role={tone === "error" ? "alert" : "status"} className={cn("rounded-md border px-3.5 py-2.5 text-sm", tones[tone], className)}>
      {children}
    </div>
  );
}
