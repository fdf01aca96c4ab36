import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { PageHeader, Panel } from "@/components/ui/panel";
import { permissionsOf } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("home"))("title") };
}

export default async function OverviewPage() {
  const actor = await requirePageActor();
  const t = await getTranslations();
  return (
    <>
      <PageHeader title={t("home.welcome", { name: actor.name })} intro={t("home.roleIntro", { role: t(`roles.${actor.role}.name`) })} />
      <div className="grid gap-6 md:grid-cols-2">
        <Panel title={t("home.canDo")} intro={t(`roles.${actor.role}.summary`)}>
          <ul className="list-disc space-y-1 pl-5 text-sm text-stone-700" data-testid="permissions">
            {permissionsOf(actor.role).map((p) => (
              <li key={p}>{t(`permissions.${p}`)}</li>
            ))}
          </ul>
        </Panel>
        <Panel title={t("home.comingTitle")}>
          <p className="text-sm text-stone-700">{t("home.comingBody")}</p>
        </Panel>
      </div>
    </>
  );
}
