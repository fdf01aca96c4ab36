import { getTranslations } from "next-intl/server";
import { AreaTabs } from "@/components/shell/area-tabs";
import { can, type Permission } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";

const tabs: { href: string; key: "people" | "settings"; permission: Permission }[] = [
  { href: "/admin", key: "people", permission: "users:manage" },
  { href: "/admin/settings", key: "settings", permission: "settings:manage" },
];

export default async function AdminLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor();
  const t = await getTranslations("admin.tabs");
  const mine = tabs.filter((tab) => can(actor.role, tab.permission));
  return (
    <>
      {mine.length ? <AreaTabs label={t("label")} tabs={mine.map((tab) => ({ href: tab.href, label: t(tab.key) }))} /> : null}
      {children}
    </>
  );
}
