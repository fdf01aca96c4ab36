"use client";

import { useRouter } from "next/navigation";
import { useTranslations } from "next-intl";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { stampUrls, type StockTakeSummary } from "@/lib/contracts/stamps";
import { ApiError, apiFetch } from "@/lib/swr/fetcher";

/** The count running at a site, if any (another keeper may have started one since the page loaded). */
async function runningCountAt(site: string): Promise<string | null> {
  const { stockTakes } = await apiFetch<{ stockTakes: StockTakeSummary[] }>("/api/v1/stock-takes");
  return stockTakes.find((s) => s.site === site && s.status === "open")?.id ?? null;
}

/** Starts a count at a site; at a site whose count is already running it opens that count instead. */
export function StartStockTake({ sites }: { sites: { site: string; openId: string | null }[] }) {
  const t = useTranslations();
  const router = useRouter();
  const [site, setSite] = useState(sites.find((s) => !s.openId)?.site ?? sites[0].site);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<ApiError | null>(null);
  const open = (id: string) => router.push(`/stamps/stock-takes/${id}`);
  async function start(event: React.FormEvent) {
    event.preventDefault();
    setBusy(true);
    setProblem(null);
    try {
      const running = sites.find((s) => s.site === site)?.openId;
      if (running) return open(running);
      const { stockTake } = await apiFetch<{ stockTake: StockTakeSummary }>(stampUrls.stockTakes(), { method: "POST", body: JSON.stringify({ site }) });
      open(stockTake.id);
    } catch (e) {
      const running = e instanceof ApiError && e.code === "stockTakeOpen" ? await runningCountAt(site).catch(() => null) : null;
      if (running) return open(running);
      setProblem(e instanceof ApiError ? e : new ApiError(0, "internal", t("common.error")));
      setBusy(false);
    }
  }
  return (
    <form onSubmit={start} className="flex flex-wrap items-start gap-3" aria-label={t("stockTake.startTitle")} noValidate>
      <div className="min-w-64">
        <Field id="stock-site" label={t("stockTake.site")} errors={problem?.fields?.site}>
          {(aria) => (
            <select {...aria} value={site} onChange={(e) => setSite(e.target.value)}>
              {sites.map((s) => (
                <option key={s.site} value={s.site}>
                  {s.openId ? t("stockTake.siteOpen", { site: s.site }) : s.site}
                </option>
              ))}
            </select>
          )}
        </Field>
      </div>
      <Button type="submit" disabled={busy} className="mt-6">
        {t("stockTake.start")}
      </Button>
      {problem && !problem.fields ? <Notice tone="error" className="w-full">{problem.message}</Notice> : null}
    </form>
  );
}
