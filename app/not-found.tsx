import { getTranslations } from "next-intl/server";
import Link from "next/link";

export default async function NotFound() {
  const t = await getTranslations("common");
  return (
    <main className="mx-auto max-w-lg px-4 py-24 text-center">
      <h1 className="text-xl font-semibold">{t("notFoundTitle")}</h1>
      <p className="mt-2 text-sm text-stone-600">{t("notFoundBody")}</p>
      <Link href="/" className="mt-6 inline-block text-sm text-ink-700 hover:underline">
        {t("backHome")}
      </Link>
    </main>
  );
}
