import { getFormatter, getTranslations } from "next-intl/server";
import type { ChangeDto } from "@/lib/contracts/wax";

const show = (value: unknown) => (value === null || value === undefined || value === "" ? "—" : typeof value === "object" ? JSON.stringify(value) : String(value));

/** Who changed a recipe or material, when, and what (field: before → after), newest first. */
export async function ChangeHistory({ changes, testId }: { changes: ChangeDto[]; testId: string }) {
  const [t, format] = await Promise.all([getTranslations("waxRoom.history"), getFormatter()]);
  if (!changes.length) return <p className="text-sm text-stone-600">{t("empty")}</p>;
  return (
    <ol className="space-y-3 text-sm" data-testid={testId}>
      {changes.map((c) => (
        <li key={c.id} className="border-l-2 border-stone-200 pl-3">
          <p className="text-stone-900">
            <span className="font-medium">{t("line", { name: c.actorName, kind: t(`kinds.${c.kind}`) })}</span>{" "}
            <span className="text-stone-600">· {format.dateTime(new Date(c.at), "moment")}</span>
            {c.kind === "duplicated" && c.note ? <span className="text-stone-600"> · {t("from", { name: c.note })}</span> : null}
          </p>
          {c.changes.length ? (
            <ul className="mt-1 text-xs text-stone-600">
              {c.changes.map((d) => (
                <li key={d.field}>{t("change", { field: d.field, from: show(d.from), to: show(d.to) })}</li>
              ))}
            </ul>
          ) : null}
        </li>
      ))}
    </ol>
  );
}
