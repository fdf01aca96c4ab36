import { cn } from "./cn";

export function Panel({ title, intro, children, className }: { title?: string; intro?: React.ReactNode; children: React.ReactNode; className?: string }) {
  return (
    <section className={cn("rounded-lg border border-stone-200 bg-white p-5 shadow-xs", className)}>
      {title ? <h2 className="text-base font-semibold text-stone-900">{title}</h2> : null}
      {intro ? <p className="mt-1 text-sm text-stone-600">{intro}</p> : null}
      <div className={title || intro ? "mt-4" : undefined}>{children}</div>
    </section>
  );
}

export function PageHeader({ title, intro, actions }: { title: string; intro?: React.ReactNode; actions?: React.ReactNode }) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-4">
      <div>
        <h1 className="text-2xl font-semibold tracking-tight text-stone-900">{title}</h1>
        {intro ? <p className="mt-1 max-w-3xl text-sm text-stone-600">{intro}</p> : null}
      </div>
      {actions}
    </div>
  );
}
