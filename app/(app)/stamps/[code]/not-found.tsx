import { getTranslations } from "next-intl/server";
import Link from "next/link";

export default async function StampNotFound() {
  const t = await getTranslations();
  return (
    <div className="mx-auto max-w-lg py-16 text-center">
      <h1 className="text-xl font-semibold">{t("stamps.record.notFoundTitle")}</h1>
      <p className="mt-2 text-sm text-stone-600">{t("stamps.record.notFoundBody")}</p>
      <Link href="/stamps" className="mt-6 inline-block text-sm text-ink-700 hover:underline">
        {t("stamps.record.backToShelf")}
      </Link>
    </div>
  );
}
