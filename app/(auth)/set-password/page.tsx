import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import Link from "next/link";
import { Notice } from "@/components/ui/notice";
import { passwordLinkStatus } from "@/lib/data/users";
import { SetPasswordForm } from "./set-password-form";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("setPassword"))("title") };
}

/** The form only for a link that still works; a missing, used, expired or unknown link says so at once. */
export default async function SetPasswordPage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  const t = await getTranslations("setPassword");
  const status = token ? await passwordLinkStatus(token) : null;
  if (status === "valid") return <SetPasswordForm token={token!} />;
  return (
    <div className="space-y-4">
      <h1 className="text-lg font-semibold">{t("title")}</h1>
      <Notice tone="error">{status ? t(`link.${status}`) : t("missingToken")}</Notice>
      <Link href="/forgot-password" className="text-sm text-ink-700 hover:underline">
        {t("requestNew")}
      </Link>
    </div>
  );
}
