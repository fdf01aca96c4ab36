import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import Link from "next/link";
import { PageHeader, Panel } from "@/components/ui/panel";
import { requirePageActor } from "@/lib/session";
import { ApiTokens } from "./api-tokens";
import { ProfileForm } from "./profile-form";
import { SessionsPanel } from "./sessions-panel";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("account"))("title") };
}

export default async function AccountPage() {
  const actor = await requirePageActor();
  const t = await getTranslations();
  return (
    <>
      <PageHeader title={t("account.title")} intro={`${actor.email} · ${t(`roles.${actor.role}.name`)}`} />
      <div className="grid gap-6 lg:grid-cols-[1fr_2fr]">
        <div className="space-y-6">
          <Panel title={t("account.profile")}>
            <ProfileForm name={actor.name} unitSystem={actor.unitSystem} locale={actor.locale} />
          </Panel>
          <SessionsPanel actor={actor} />
        </div>
        <Panel title={t("account.tokens.title")} intro={t("account.tokens.intro")}>
          <ApiTokens />
          <p className="mt-4 text-sm">
            <Link href="/api-reference" className="text-stone-800 underline underline-offset-2 hover:text-stone-950">
              {t("account.tokens.reference")}
            </Link>
          </p>
        </Panel>
      </div>
    </>
  );
}
