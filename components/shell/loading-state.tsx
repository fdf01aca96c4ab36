import { getTranslations } from "next-intl/server";

/** What a page shows while it loads (loading.tsx files, Suspense fallbacks). */
export async function LoadingState() {
  const t = await getTranslations("common");
  return (
    <div className="flex items-center gap-3 py-16 text-sm text-stone-500" role="status">
      <span className="h-4 w-4 animate-spin rounded-full border-2 border-stone-300 border-t-ink-600" aria-hidden="true" />
      {t("loading")}
    </div>
  );
}
