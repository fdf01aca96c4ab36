import { getTranslations } from "next-intl/server";
import Link from "next/link";

export async function Forbidden() {
  const t = await getTranslations("common");
  return (
    <div className="mx-auto max-w-lg py-16 text-center">
      <h1 className="text-xl font-semibold">{t("forbiddenTitle")}</h1>
      <p className="mt-2 text-sm text-stone-600">{t("forbiddenBody")}</p>
      <Link href="/" className="mt-6 inline-block text-sm text-ink-700 hover:underline">
        {t("backHome")}
      </Link>
    </div>
  );
}
