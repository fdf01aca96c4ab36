import { getTranslations } from "next-intl/server";
import { AreaTabs } from "@/components/shell/area-tabs";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";

export default async function PlansLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor();
  const t = await getTranslations("plans");
  const tabs = [{ href: "/plans", label: t("tabs.plans") }, ...(can(actor.role, "plans:write") ? [{ href: "/plans/new", label: t("tabs.new") }] : [])];
  return (
    <>
      <AreaTabs label={t("tabs.label")} tabs={tabs} />
      {children}
    </>
  );
}
