import { getFormatter, getTranslations } from "next-intl/server";
import { cn } from "@/components/ui/cn";
import type { StampEventDto } from "@/lib/contracts/stamps";
import { damageKinds, stampConditions, stampFaces } from "@/lib/validation/stamps";
import type { UnitSystem } from "@/lib/stamps/format";
import { calendarDay } from "@/lib/i18n/formats";
import { measures } from "@/lib/i18n/measures";

const dots: Record<string, string> = {
  created: "bg-ink-600",
  edited: "bg-stone-400",
  moved: "bg-sky-600",
  checked_out: "bg-ink-500",
  returned: "bg-emerald-600",
  condition_changed: "bg-amber-500",
  damage_reported: "bg-red-600",
  repaired: "bg-emerald-700",
  twin_linked: "bg-soga-500",
  seen_in_stock_take: "bg-stone-500",
  scanned: "bg-stone-500",
  impressions_added: "bg-stone-400",
};

const lengthFields = new Set(["widthMm", "heightMm", "stripDepthMm"]);
/** Fields whose changes the history names; any other field shows its raw name. */
const namedFields = ["code", "name", "widthMm", "heightMm", "stripDepthMm", "weightG", "face", "mirrored", "twinCode", "maker", "madeOn", "condition", "location", "coverageRatio", "outlinePath", "impressionsCount", "notes", "tags", "motifId"] as const;

/** Narrows a stored value to one of a list, so its catalogue key is known to exist. */
const oneOf = <T extends string>(list: readonly T[], value: unknown): value is T => list.includes(value as T);

/** The stamp's story, newest first: who did what, when. */
export async function StampHistory({ events, unitSystem }: { events: StampEventDto[]; unitSystem: UnitSystem }) {
  const t = await getTranslations();
  const format = await getFormatter();
  const measure = measures(format, unitSystem);
  const none = t("stamps.history.none");
  const condition = (c: string | null) => (oneOf(stampConditions, c) ? t(`stamps.conditions.${c}`) : (c ?? none));
  const value = (field: string, v: unknown): string => {
    if (v === null || v === undefined || v === "") return none;
    if (lengthFields.has(field) && typeof v === "number") return measure.length(v);
    if (field === "weightG" && typeof v === "number") return measure.mass(v);
    if (field === "coverageRatio" && typeof v === "number") return measure.percent(v);
    if (field === "face" && oneOf(stampFaces, v)) return t(`stamps.faces.${v}`);
    if (typeof v === "boolean") return v ? t("stamps.yes") : t("stamps.no");
    if (Array.isArray(v)) return v.join(", ") || none;
    if (field === "outlinePath") return t("stamps.history.outline");
    if (typeof v === "number") return measure.count(v);
    return String(v);
  };
  const date = (iso: string) => format.dateTime(calendarDay(iso), "day");

  function describe(e: StampEventDto): { text: string; extra?: string[] } {
    const d = e.details ?? {};
    switch (e.kind) {
      case "created":
        return { text: t("stamps.history.created", { actor: e.actorName }) };
      case "edited": {
        const changes = (d.changes as { field: string; from: unknown; to: unknown }[] | undefined) ?? [];
        return {
          text: t("stamps.history.edited", { actor: e.actorName, count: changes.length }),
          extra: changes.map((c) => t("stamps.history.change", { field: oneOf(namedFields, c.field) ? t(`stamps.fields.${c.field}`) : c.field, from: value(c.field, c.from), to: value(c.field, c.to) })),
        };
      }
      case "moved":
        return {
          text: t("stamps.history.moved", { actor: e.actorName, from: e.from ?? t("stamps.history.nowhere"), to: e.to ?? t("stamps.history.nowhere") }),
          extra: d.stockTakeSite ? [t("stamps.history.afterStockTake", { site: String(d.stockTakeSite) })] : undefined,
        };
      case "checked_out":
        return {
          text: t("stamps.history.checkedOut", { actor: e.actorName, borrower: e.to ?? "", workstation: String(d.workstation ?? ""), due: d.dueOn ? date(String(d.dueOn)) : "" }),
        };
      case "returned": {
        const extra: string[] = [];
        if (d.impressions) extra.push(t("stamps.history.impressions", { count: Number(d.impressions) }));
        if (d.late) extra.push(t("stamps.history.late"));
        return { text: t("stamps.history.returned", { actor: e.actorName, borrower: e.from ?? "" }), extra };
      }
      case "condition_changed":
        return { text: t("stamps.history.conditionChanged", { actor: e.actorName, from: condition(e.from), to: condition(e.to) }) };
      case "repaired":
        return { text: t("stamps.history.repaired", { actor: e.actorName, to: condition(e.to) }) };
      case "damage_reported":
        return { text: t("stamps.history.damageReported", { actor: e.actorName, kind: oneOf(damageKinds, e.to) ? t(`stamps.damageKinds.${e.to}`) : (e.to ?? none) }) };
      case "twin_linked":
        return e.to ? { text: t("stamps.history.twinLinked", { actor: e.actorName, code: e.to }) } : { text: t("stamps.history.twinUnlinked", { actor: e.actorName, code: e.from ?? none }) };
      case "scanned":
        return { text: t("stamps.history.scanned", { actor: e.actorName, kind: t(d.kind === "print" ? "scans.kindShort.print" : "scans.kindShort.face") }) };
      case "impressions_added": {
        const count = Math.abs(Number(d.impressions ?? e.to ?? 0));
        return { text: d.withdrawn || Number(d.impressions) < 0 ? t("stamps.history.impressionsWithdrawn", { actor: e.actorName, count }) : t("stamps.history.impressionsAdded", { actor: e.actorName, count }) };
      }
      case "seen_in_stock_take":
        return { text: t("stamps.history.seen", { actor: e.actorName, place: e.to ?? none }) };
      default:
        return { text: t("stamps.history.other", { actor: e.actorName }) };
    }
  }

  if (events.length === 0) return <p className="text-sm text-stone-500">{t("stamps.history.empty")}</p>;
  return (
    <ol className="relative space-y-4 border-l border-stone-200 pl-5" data-testid="history">
      {events.map((e) => {
        const { text, extra } = describe(e);
        return (
          <li key={e.id} data-kind={e.kind} className="relative">
            <span className={cn("absolute -left-[1.6rem] top-1.5 h-2.5 w-2.5 rounded-full ring-4 ring-white", dots[e.kind] ?? "bg-stone-400")} aria-hidden="true" />
            <p className="text-sm text-stone-800">{text}</p>
            {extra?.length ? (
              <ul className="mt-0.5 text-xs text-stone-600">
                {extra.map((x) => (
                  <li key={x}>{x}</li>
                ))}
              </ul>
            ) : null}
            {e.note ? <p className="mt-0.5 text-xs italic text-stone-600">“{e.note}”</p> : null}
            <p className="mt-0.5 text-xs text-stone-500">
              <time dateTime={e.at}>{format.dateTime(new Date(e.at), "moment")}</time>
            </p>
          </li>
        );
      })}
    </ol>
  );
}
