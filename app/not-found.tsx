import { getTranslations } from "next-intl/server";
import { MessagePage } from "@/components/shell/message-page";

export default async function NotFound() {
  const t = await getTranslations("common");
  return (
    <main className="px-4">
      <MessagePage title={t("notFoundTitle")} body={t("notFoundBody")} back={{ href: "/", label: t("backHome") }} />
    </main>
  );
}
