import { getTranslations } from "next-intl/server";
import { AreaTabs } from "@/components/shell/area-tabs";
import { SafetyCautions } from "@/components/wax/safety-cautions";
import { waxPages } from "@/lib/contracts/wax";
import { requirePageActor } from "@/lib/session";

/** The wax room: its tabs, and the safety cautions on every screen of it. */
export default async function WaxRoomLayout({ children }: { children: React.ReactNode }) {
  await requirePageActor();
  const t = await getTranslations("waxRoom.tabs");
  return (
    <>
      <AreaTabs
        label={t("label")}
        tabs={[
          { href: waxPages.overview, label: t("overview") },
          { href: waxPages.recipes, label: t("recipes") },
          { href: waxPages.materials, label: t("materials") },
          { href: waxPages.estimates, label: t("estimates") },
          { href: waxPages.uses, label: t("uses") },
          { href: waxPages.purchase, label: t("purchase") },
        ]}
      />
      <SafetyCautions />
      {children}
    </>
  );
}
