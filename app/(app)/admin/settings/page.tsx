import type { Metadata } from "next";
import { getFormatter, getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader, Panel } from "@/components/ui/panel";
import { getSettingsPage } from "@/lib/data/settings";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { timeZoneNames } from "@/lib/time-zone";
import type { WorkshopSettingKey } from "@/lib/validation/settings";
import { SettingsForm } from "./settings-form";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("settings"))("title") };
}

export default async function WorkshopSettingsPage() {
  const actor = await requirePageActor();
  if (!can(actor.role, "settings:manage")) return <Forbidden />;
  const [t, format, page] = await Promise.all([getTranslations("settings"), getFormatter(), getSettingsPage(actor)]);
  const shown = (value: unknown) =>
    value === null || value === undefined
      ? t("history.unset")
      : Array.isArray(value)
        ? value.map((p: { name?: string; widthMm?: number }) => `${p.name ?? ""} (${p.widthMm ?? ""} mm)`).join(", ")
        : String(value);
  return (
    <>
      <PageHeader title={t("title")} intro={t("intro")} />
      <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
        <Panel title={t("formLabel")} intro={t("timeIntro")}>
          <SettingsForm settings={page.settings} version={page.version} timeZones={timeZoneNames()} />
        </Panel>
        <Panel title={t("history.title")}>
          {page.history.length === 0 ? (
            <p className="text-sm text-stone-500">{t("history.none")}</p>
          ) : (
            <ol className="space-y-3 text-sm" data-testid="settings-history">
              {page.history.map((entry) => (
                <li key={entry.id} className="border-b border-stone-100 pb-2 last:border-0">
                  <p className="text-stone-500">
                    <time dateTime={entry.at}>{format.dateTime(new Date(entry.at), "moment")}</time> · {entry.actorName}
                  </p>
                  <ul>
                    {entry.changes.map((c) => (
                      <li key={c.key} className="text-stone-800">
                        {t("history.change", { setting: t(`fields.${c.key as WorkshopSettingKey}.label`), from: shown(c.from), to: shown(c.to) })}
                      </li>
                    ))}
                  </ul>
                </li>
              ))}
            </ol>
          )}
        </Panel>
      </div>
    </>
  );
}
