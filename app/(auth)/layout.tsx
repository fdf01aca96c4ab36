import { getTranslations } from "next-intl/server";
import { LanguageSwitch } from "@/components/shell/language-switch";
import { Logo } from "@/components/shell/logo";

export default async function AuthLayout({ children }: { children: React.ReactNode }) {
  const t = await getTranslations("app");
  return (
    <main className="flex min-h-screen flex-col items-center justify-center px-4 py-12">
      <div className="mb-8 flex flex-col items-center gap-2 text-center">
        <Logo className="h-10 w-10" />
        <p className="text-xl font-semibold tracking-tight text-ink-800">{t("name")}</p>
        <p className="max-w-sm text-sm text-stone-600">{t("tagline")}</p>
      </div>
      <div className="w-full max-w-sm rounded-lg border border-stone-200 bg-white p-6 shadow-sm">{children}</div>
      <div className="mt-6">
        <LanguageSwitch tone="light" />
      </div>
    </main>
  );
}
