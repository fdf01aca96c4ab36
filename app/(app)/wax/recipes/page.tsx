import type { Metadata } from "next";
import Link from "next/link";
import { getTranslations } from "next-intl/server";
import { Notice } from "@/components/ui/notice";
import { PageHeader, Panel } from "@/components/ui/panel";
import { waxPages } from "@/lib/contracts/wax";
import { listRecipes } from "@/lib/data/wax";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { CompareChooser } from "./compare-chooser";
import { RecipesTable } from "./recipes-table";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("waxRoom.recipes"))("title") };
}

type Props = { searchParams: Promise<{ deleted?: string }> };

export default async function WaxRecipesPage({ searchParams }: Props) {
  const actor = await requirePageActor();
  const { deleted } = await searchParams;
  const [t, recipes] = await Promise.all([getTranslations("waxRoom.recipes"), listRecipes(actor)]);
  return (
    <>
      <PageHeader
        title={t("title")}
        intro={t("intro")}
        actions={
          can(actor.role, "wax:write") ? (
            <Link href={waxPages.newRecipe} className="rounded-md bg-ink-700 px-3.5 py-2 text-sm font-medium text-white hover:bg-ink-800">
              {t("new")}
            </Link>
          ) : null
        }
      />
      {deleted ? <Notice tone="success" className="mb-4">{t("deleted", { name: deleted })}</Notice> : null}
      <div className="space-y-6">
        <Panel>
          <RecipesTable recipes={recipes} unitSystem={actor.unitSystem} />
        </Panel>
        {recipes.length >= 2 ? (
          <Panel title={t("compareTitle")}>
            <CompareChooser recipes={recipes.map((r) => ({ id: r.id, name: r.name }))} />
          </Panel>
        ) : null}
      </div>
    </>
  );
}
