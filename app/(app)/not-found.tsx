import { getTranslations } from "next-intl/server";
import { MessagePage } from "@/components/shell/message-page";

/** notFound() anywhere in the app: inside the app's layout, so the header and navigation stay. */
export default async function AppNotFound() {
  const t = await getTranslations("common");
  return <MessagePage title={t("notFoundTitle")} body={t("notFoundBody")} back={{ href: "/", label: t("backHome") }} />;
}
