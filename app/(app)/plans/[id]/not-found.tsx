import { getTranslations } from "next-intl/server";
import { MessagePage } from "@/components/shell/message-page";

export default async function PlanNotFound() {
  const t = await getTranslations("plans");
  return <MessagePage title={t("record.notFoundTitle")} body={t("record.notFoundBody")} back={{ href: "/plans", label: t("record.backToPlans") }} />;
}
