import type { Metadata } from "next";
import Link from "next/link";
import { getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/panel";
import { planPages } from "@/lib/contracts/plans";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { PlansTable } from "./plans-table";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("plans"))("title") };
}

export default async function PlansPage({ searchParams }: { searchParams: Promise<{ deleted?: string }> }) {
  const actor = await requirePageActor();
  if (!can(actor.role, "data:read")) return <Forbidden />;
  const { deleted } = await searchParams;
  const t = await getTranslations("plans");
  const canWrite = can(actor.role, "plans:write");
  return (
    <>
      <PageHeader
        title={t("title")}
        intro={t("intro")}
        actions={
          canWrite ? (
            <Link href={planPages.new()} className="rounded-md bg-ink-700 px-3.5 py-2 text-sm font-medium text-white hover:bg-ink-800">
              {t("actions.new")}
            </Link>
          ) : null
        }
      />
      {deleted ? (
        <Notice tone="success" className="mb-4">
          {t("saved.deleted")}
        </Notice>
      ) : null}
      <PlansTable unitSystem={actor.unitSystem} canWrite={canWrite} />
    </>
  );
}
