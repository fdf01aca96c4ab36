import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader, Panel } from "@/components/ui/panel";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { csvColumns, csvRequiredColumns } from "@/lib/stamps/csv";
import { ImportForm } from "./import-form";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("stampImport"))("title") };
}

export default async function ImportPage() {
  const actor = await requirePageActor();
  if (!can(actor.role, "stamps:write")) return <Forbidden />;
  const t = await getTranslations();
  return (
    <>
      <PageHeader title={t("stampImport.title")} intro={t("stampImport.intro")} />
      <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
        <Panel title={t("stampImport.uploadTitle")}>
          <ImportForm />
        </Panel>
        <Panel title={t("stampImport.formatTitle")} intro={t("stampImport.formatIntro")}>
          <ul className="space-y-1 text-sm">
            {csvColumns.map(([column]) => (
              <li key={column}>
                <code className="font-mono text-ink-800">{column}</code>
                {(csvRequiredColumns as readonly string[]).includes(column) ? <span className="ml-1 text-xs text-red-700">{t("stampImport.required")}</span> : null}
                <span className="block text-xs text-stone-600">{t(`stampImport.columns.${column}`)}</span>
              </li>
            ))}
          </ul>
          <a
            href={`data:text/csv;charset=utf-8,${encodeURIComponent(`${csvColumns.map(([c]) => c).join(",")}\r\nCP-9001,Kawung small,180,180,12,850,single,no,,,2001-05-01,sound,,,0.4,0,kawung;filler,,\r\n`)}`}
            download="stamps-template.csv"
            className="mt-4 inline-block text-sm text-ink-700 hover:underline"
          >
            {t("stampImport.template")}
          </a>
        </Panel>
      </div>
    </>
  );
}
