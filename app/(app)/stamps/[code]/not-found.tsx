import { getTranslations } from "next-intl/server";
import { MessagePage } from "@/components/shell/message-page";

export default async function StampNotFound() {
  const t = await getTranslations("stamps.record");
  return <MessagePage title={t("notFoundTitle")} body={t("notFoundBody")} back={{ href: "/stamps", label: t("backToShelf") }} />;
}
