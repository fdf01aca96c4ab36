import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import Link from "next/link";
import { AppHeader } from "@/components/shell/app-header";
import { Logo } from "@/components/shell/logo";
import { MessagePage } from "@/components/shell/message-page";
import { currentActor } from "@/lib/session";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("common"))("notFoundTitle") };
}

/** An address no route knows: with the app's header and navigation for the signed-in, the way to sign in for others. */
export default async function NotFound() {
  const [t, actor] = await Promise.all([getTranslations(), currentActor().catch(() => null)]);
  return (
    <>
      {actor ? (
        <AppHeader actor={actor} />
      ) : (
        <header className="bg-ink-900 text-white">
          <div className="mx-auto flex max-w-7xl items-center justify-between px-4 py-2.5">
            <Link href="/" className="flex items-center gap-2 font-semibold tracking-tight">
              <Logo className="h-7 w-7" />
              {t("app.name")}
            </Link>
            <Link href="/signin" className="text-sm text-ink-100 hover:text-white">
              {t("signin.submit")}
            </Link>
          </div>
        </header>
      )}
      <main id="main" className="mx-auto max-w-7xl px-4">
        <MessagePage title={t("common.notFoundTitle")} body={t("common.notFoundBody")} back={{ href: "/", label: t("common.backHome") }} />
      </main>
    </>
  );
}
