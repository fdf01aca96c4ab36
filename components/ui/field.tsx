import { cn } from "./cn";

const control =
  "block w-full rounded-md border border-stone-300 bg-white px-3 py-2 text-sm shadow-xs placeholder:text-stone-400 focus:border-ink-500 aria-invalid:border-red-500";

interface FieldProps {
  id: string;
  label: string;
  errors?: string[];
  hint?: string;
  children: (aria: { id: string; "aria-invalid"?: boolean; "aria-describedby"?: string; className: string }) => React.ReactNode;
}

/** A labelled control with a hint and an error slot the control points at (aria-describedby). */
export function Field({ id, label, errors, hint, children }: FieldProps) {
  const errorId = `${id}-error`;
  const hintId = `${id}-hint`;
  const describedBy = [hint ? hintId : null, errors?.length ? errorId : null].filter(Boolean).join(" ") || undefined;
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium text-stone-800">
        {label}
      </label>
      {children({ id, "aria-invalid": errors?.length ? true : undefined, "aria-describedby": describedBy, className: control })}
      {hint ? (
        <p id={hintId} className="text-xs text-stone-500">
          {hint}
        </p>
      ) : null}
      <p id={errorId} className={cn("text-sm text-red-700", !errors?.length && "sr-only")} aria-live="polite">
        {errors?.join(" ")}
      </p>
    </div>
  );
}
