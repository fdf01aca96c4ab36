import { cn } from "./cn";

type Variant = "primary" | "secondary" | "danger" | "ghost";

const variants: Record<Variant, string> = {
  primary: "bg-ink-700 text-white hover:bg-ink-800 disabled:bg-ink-200",
  secondary: "border border-stone-300 bg-white text-stone-800 hover:bg-stone-100 disabled:text-stone-400",
  danger: "border border-red-300 bg-white text-red-800 hover:bg-red-50 disabled:text-red-300",
  ghost: "text-ink-700 hover:bg-ink-50",
};

export function Button({ variant = "primary", className, ...props }: React.ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return (
    <button
      className={cn("inline-flex items-center justify-center gap-2 rounded-md px-3.5 py-2 text-sm font-medium transition-colors disabled:cursor-not-allowed", variants[variant], className)}
      {...props}
    />
  );
}
