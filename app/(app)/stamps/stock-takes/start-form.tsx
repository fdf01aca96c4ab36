"use client";

import { useRouter } from "next/navigation";
import { useTranslations } from "next-intl";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { stampUrls, type StockTakeSummary } from "@/lib/contracts/stamps";
import { ApiError, apiFetch } from "@/lib/swr/fetcher";

export function StartStockTake({ sites }: { sites: { site: string; open: boolean }[] }) {
  const t = useTranslations();
  const router = useRouter();
  const [site, setSite] = useState(sites.find((s) => !s.open)?.site ?? sites[0].site);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<ApiError | null>(null);
  async function start(event: React.FormEvent) {
    event.preventDefault();
    setBusy(true);
    setProblem(null);
    try {
      const { stockTake } = await apiFetch<{ stockTake: StockTakeSummary }>(stampUrls.stockTakes(), { method: "POST", body: JSON.stringify({ site }) });
      router.push(`/stamps/stock-takes/${stockTake.id}`);
    } catch (e) {
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
                  {s.open ? t("stockTake.siteOpen", { site: s.site }) : s.site}
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
