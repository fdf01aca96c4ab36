import { getTranslations } from "next-intl/server";
import { MessagePage } from "./message-page";

export async function Forbidden() {
  const t = await getTranslations("common");
  return <MessagePage title={t("forbiddenTitle")} body={t("forbiddenBody")} back={{ href: "/", label: t("backHome") }} />;
}
