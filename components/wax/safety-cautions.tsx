import { useTranslations } from "next-intl";
import { cn } from "@/components/ui/cn";

// i18n-keys: waxRoom.safety.*
const cautions = ["burns", "fire", "fumes", "clothing", "water", "floors"] as const;

/**
 * The cautions every wax screen shows (SPEC 5.3), and who decides: codes, the supplier's SDS, licensed practice.
 * Not async (useTranslations), so server pages and client components render the same block: `page` at the top
 * of a wax screen, `compact` beside a pot reading form, `alert` at once after a reading that calls for them.
 * `headingId` keeps the heading's id unique where several blocks share a page (one per stage).
 */
export function SafetyCautions({ variant = "page", headingId = "wax-safety-title" }: { variant?: "page" | "compact" | "alert"; headingId?: string }) {
  const t = useTranslations("waxRoom.safety");
  const alert = variant === "alert";
  return (
    <section
      aria-labelledby={headingId}
      role={alert ? "alert" : undefined}
      data-testid="wax-safety"
      data-variant={variant}
      className={cn(
        "rounded-lg border px-4 py-3 print:border-stone-400 print:bg-white",
        alert ? "border-2 border-red-400 bg-red-50 text-red-950" : "border-amber-300 bg-amber-50 text-amber-950",
        variant === "page" && "mb-6",
      )}
    >
      <h2 id={headingId} className={cn("font-semibold", alert ? "text-base" : "text-sm")}>
        {t("title")}
      </h2>
      <ul className={cn("mt-2 grid gap-x-6 gap-y-1 sm:grid-cols-2", alert ? "text-sm" : "text-xs", variant !== "compact" && "lg:grid-cols-3")}>
        {cautions.map((c) => (
          <li key={c} data-caution={c}>
            <span className="font-semibold">{t(`${c}.title`)}</span> {t(`${c}.body`)}
          </li>
        ))}
      </ul>
      <p className={cn("mt-2 font-medium", alert ? "text-sm" : "text-xs")} data-testid="wax-safety-decides">
        {t("decides")}
      </p>
    </section>
  );
}
