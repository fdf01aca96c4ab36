"use client";

import Link from "next/link";
import { useTranslations } from "next-intl";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { stampUrls } from "@/lib/contracts/stamps";

interface Problem {
  line: number;
  column: string | null;
  message: string;
}
type Outcome =
  | { kind: "ok"; dryRun: boolean; rows: number; created: number; updated: number }
  | { kind: "invalid"; message: string; rows: Problem[] }
  | { kind: "error"; message: string }
  | { kind: "noFile"; message: string };

/** Sends the chosen file as text/csv; a check first (nothing stored), then the import itself. */
export function ImportForm() {
  const t = useTranslations();
  const [file, setFile] = useState<File | null>(null);
  const [busy, setBusy] = useState(false);
  const [outcome, setOutcome] = useState<Outcome | null>(null);

  async function send(dryRun: boolean) {
    if (!file) {
      setOutcome({ kind: "noFile", message: t("stampImport.chooseFirst") });
      return;
    }
    setBusy(true);
    setOutcome(null);
    try {
      const response = await fetch(stampUrls.import(dryRun), { method: "POST", headers: { "content-type": "text/csv", accept: "application/json" }, body: await file.text() });
      const body = await response.json().catch(() => null);
      if (response.ok) setOutcome({ kind: "ok", ...body.import });
      else if (body?.error?.rows) setOutcome({ kind: "invalid", message: body.error.message, rows: body.error.rows });
      else setOutcome({ kind: "error", message: body?.error?.message ?? t("common.error") });
    } catch {
      setOutcome({ kind: "error", message: t("common.error") });
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="space-y-4">
      <Field id="import-file" label={t("stampImport.file")} errors={outcome?.kind === "noFile" ? [outcome.message] : undefined}>
        {(aria) => (
          <input
            {...aria}
            type="file"
            accept=".csv,text/csv"
            onChange={(e) => {
              setFile(e.target.files?.[0] ?? null);
              setOutcome(null);
            }}
            className="block w-full text-sm font-normal file:mr-3 file:rounded-md file:border file:border-stone-300 file:bg-white file:px-3 file:py-1.5"
          />
        )}
      </Field>
      <div className="flex flex-wrap gap-2">
        <Button type="button" variant="secondary" disabled={busy} onClick={() => send(true)}>
          {t("stampImport.check")}
        </Button>
        <Button type="button" disabled={busy} onClick={() => send(false)}>
          {busy ? t("stampImport.working") : t("stampImport.import")}
        </Button>
      </div>
      {outcome?.kind === "ok" ? (
        <Notice tone="success">
          {outcome.dryRun ? t("stampImport.checked", { rows: outcome.rows, created: outcome.created, updated: outcome.updated }) : t("stampImport.done", { created: outcome.created, updated: outcome.updated })}{" "}
          {!outcome.dryRun ? (
            <Link href="/stamps?sort=-updated" className="underline">
              {t("stampImport.see")}
            </Link>
          ) : null}
        </Notice>
      ) : null}
      {outcome?.kind === "error" ? <Notice tone="error">{outcome.message}</Notice> : null}
      {outcome?.kind === "invalid" ? (
        <div className="space-y-2">
          <Notice tone="error">{outcome.message}</Notice>
          <div className="max-h-96 overflow-auto rounded-md border border-stone-200">
            <table className="min-w-full divide-y divide-stone-200 text-sm" aria-label={t("stampImport.problems")}>
              <thead className="sticky top-0 bg-stone-50 text-left">
                <tr>
                  <th scope="col" className="px-3 py-2 font-semibold">{t("stampImport.line")}</th>
                  <th scope="col" className="px-3 py-2 font-semibold">{t("stampImport.column")}</th>
                  <th scope="col" className="px-3 py-2 font-semibold">{t("stampImport.problem")}</th>
                </tr>
              </thead>
              <tbody className="divide-y divide-stone-100">
                {outcome.rows.map((p, i) => (
                  <tr key={i}>
                    <td className="px-3 py-1.5 tabular-nums">{p.line}</td>
                    <td className="px-3 py-1.5 font-mono text-xs">{p.column ?? "—"}</td>
                    <td className="px-3 py-1.5">{p.message}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </div>
      ) : null}
    </div>
  );
}
