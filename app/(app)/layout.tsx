import { getTranslations } from "next-intl/server";
import { AppHeader } from "@/components/shell/app-header";
import { requirePageActor } from "@/lib/session";

export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor();
  const t = await getTranslations("app");
  return (
    <>
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:m-2 focus:rounded focus:bg-white focus:p-2">
        {t("skipToContent")}
      </a>
      <AppHeader actor={actor} />
      <main id="main" className="mx-auto max-w-7xl px-4 py-8">
        {children}
      </main>
    </>
  );
}
