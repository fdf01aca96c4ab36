import type { Metadata } from "next";
import Link from "next/link";
import { getFormatter, getTranslations } from "next-intl/server";
import { RunStateBadge } from "@/components/runs/run-state-badge";
import { runSizeText } from "@/components/runs/run-size";
import { Forbidden } from "@/components/shell/forbidden";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/panel";
import { runPages, runStates, stageNumber, type RunState } from "@/lib/contracts/runs";
import { listRuns } from "@/lib/data/runs";
import { calendarDay } from "@/lib/i18n/formats";
import { measures } from "@/lib/i18n/measures";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { queryObject } from "@/lib/validation/common";
import { parseInput } from "@/lib/validation/parse";
import { runListQuerySchema } from "@/lib/validation/runs";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("runs"))("list.title") };
}

const PAGE_SIZE = 25;

/** The runs: search and state in the address (a plain GET form, so it works without JavaScript), newest change first. */
export default async function RunsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePageActor();
  if (!can(actor.role, "data:read")) return <Forbidden />;
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(await searchParams)) for (const one of Array.isArray(v) ? v : v ? [v] : []) params.append(k, one);
  const [t, format] = await Promise.all([getTranslations(), getFormatter()]);
  const parsed = parseInput(runListQuerySchema, { pageSize: String(PAGE_SIZE), ...queryObject(params) });
  const answer = parsed.success ? await listRuns(actor, parsed.data) : null;
  const canWrite = can(actor.role, "runs:write");
  const state = params.get("state") ?? "";
  const m = measures(format, actor.unitSystem);
  const pages = answer ? Math.max(1, Math.ceil(answer.total / answer.pageSize)) : 1;
  const pageHref = (n: number) => {
    const next = new URLSearchParams(params);
    if (n > 1) next.set("page", String(n));
    else next.delete("page");
    const text = next.toString();
    return `${runPages.list()}${text ? `?${text}` : ""}`;
  };
  return (
    <>
      <PageHeader
        title={t("runs.list.title")}
        intro={t("runs.list.intro")}
        actions={
          canWrite ? (
            <Link href={runPages.new()} className="rounded-md bg-ink-700 px-3.5 py-2 text-sm font-medium text-white hover:bg-ink-800">
              {t("runs.list.new")}
            </Link>
          ) : null
        }
      />
      {params.get("deleted") ? (
        <Notice tone="success" className="mb-4">
          {t("runs.saved.deleted")}
        </Notice>
      ) : null}
      <form role="search" method="get" action={runPages.list()} className="mb-4 flex flex-wrap items-end gap-3" aria-label={t("runs.list.filters")}>
        <label className="space-y-1 text-sm">
          <span className="block font-medium text-stone-800">{t("runs.list.search")}</span>
          <input name="q" type="search" defaultValue={params.get("q") ?? ""} className="rounded-md border border-stone-300 px-3 py-2" />
        </label>
        <label className="space-y-1 text-sm">
          <span className="block font-medium text-stone-800">{t("runs.list.state")}</span>
          <select name="state" defaultValue={state} className="rounded-md border border-stone-300 bg-white px-3 py-2">
            <option value="">{t("runs.list.anyState")}</option>
            <option value="setup,underway">{t("runs.list.open")}</option>
            {runStates.map((s) => (
              <option key={s} value={s}>
                {t(`runs.state.${s}`)}
              </option>
            ))}
          </select>
        </label>
        <button type="submit" className="rounded-md border border-stone-300 bg-white px-3.5 py-2 text-sm font-medium text-stone-800 hover:bg-stone-50">
          {t("runs.list.apply")}
        </button>
      </form>
      {!answer ? (
        <Notice tone="error">{t("runs.list.badQuery")}</Notice>
      ) : answer.runs.length === 0 ? (
        <p className="rounded-lg border border-dashed border-stone-300 p-6 text-sm text-stone-600" data-testid="runs-empty">
          {params.get("q") || state ? t("runs.list.noneFound") : t("runs.list.none")}
        </p>
      ) : (
        <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white">
          <table className="min-w-full text-sm" data-testid="runs-table">
            <caption className="sr-only">{t("runs.list.caption", { count: answer.total })}</caption>
            <thead className="bg-stone-50 text-left text-xs uppercase tracking-wide text-stone-600">
              <tr>
                <th scope="col" className="px-3 py-2">{t("runs.list.name")}</th>
                <th scope="col" className="px-3 py-2">{t("runs.list.motif")}</th>
                <th scope="col" className="px-3 py-2">{t("runs.list.size")}</th>
                <th scope="col" className="px-3 py-2">{t("runs.list.stateColumn")}</th>
                <th scope="col" className="px-3 py-2">{t("runs.list.wax")}</th>
                <th scope="col" className="px-3 py-2">{t("runs.list.due")}</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-stone-100">
              {answer.runs.map((r) => (
                <tr key={r.id}>
                  <td className="px-3 py-2">
                    <Link href={runPages.one(r.id)} className="font-medium text-ink-700 hover:underline">
                      {r.name}
                    </Link>
                    {r.waitingForPlan ? <span className="block text-xs text-amber-800">{t("runs.list.waitingForPlan")}</span> : null}
                  </td>
                  <td className="px-3 py-2">
                    {r.motif.name}
                    <span className="block text-xs text-stone-500">{r.colourway.name}</span>
                  </td>
                  <td className="whitespace-nowrap px-3 py-2 tabular-nums">
                    {runSizeText(t, m, r.size, actor.unitSystem)}
                    <span className="block text-xs text-stone-500">{r.cloth}</span>
                  </td>
                  <td className="px-3 py-2">
                    <RunStateBadge state={r.state as RunState} />
                    {r.state === "underway" && r.currentStage ? (
                      <span className="block text-xs text-stone-600">{t("runs.list.atStage", { n: stageNumber(r.currentStage), of: r.stageCount, kind: t(`runs.stageKind.${r.currentStage.kind}`) })}</span>
                    ) : null}
                  </td>
                  <td className="whitespace-nowrap px-3 py-2 tabular-nums">
                    {t("runs.list.waxFigures", { estimated: m.mass(r.totals.wax.kgEstimated * 1000), used: m.mass(r.totals.wax.kgUsed * 1000) })}
                  </td>
                  <td className="whitespace-nowrap px-3 py-2">{r.dueOn ? format.dateTime(calendarDay(r.dueOn), "day") : "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {answer && pages > 1 ? (
        <nav aria-label={t("runs.list.pages")} className="mt-3 flex items-center gap-3 text-sm">
          {answer.page > 1 ? <Link href={pageHref(answer.page - 1)} className="text-ink-700 hover:underline">{t("runs.list.previous")}</Link> : null}
          <span>{t("runs.list.pageOf", { page: answer.page, pages })}</span>
          {answer.page < pages ? <Link href={pageHref(answer.page + 1)} className="text-ink-700 hover:underline">{t("runs.list.next")}</Link> : null}
        </nav>
      ) : null}
    </>
  );
}
