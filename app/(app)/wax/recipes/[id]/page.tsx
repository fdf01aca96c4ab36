import type { Metadata } from "next";
import Link from "next/link";
import { getTranslations } from "next-intl/server";
import { Notice } from "@/components/ui/notice";
import { PageHeader, Panel } from "@/components/ui/panel";
import { ChangeHistory } from "@/components/wax/change-history";
import { RecipeFacts } from "@/components/wax/recipe-facts";
import { waxPages } from "@/lib/contracts/wax";
import { recipeChoices, recipeHistory } from "@/lib/data/wax";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { archiveRecipeAction, deleteRecipeAction, duplicateRecipeAction } from "../../actions";
import { loadRecipe } from "../load";
import { DuplicateForm, RecipeLifecycle } from "./recipe-actions";

type Props = { params: Promise<{ id: string }>; searchParams: Promise<{ saved?: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const actor = await requirePageActor();
  return { title: (await loadRecipe(actor, (await params).id)).name };
}

const savedKinds = ["created", "edited", "duplicated"] as const;

/** One recipe: its mix, density, melting and working ranges, the flash-point rule; duplicate, compare, history. */
export default async function WaxRecipePage({ params, searchParams }: Props) {
  const actor = await requirePageActor();
  const { id } = await params;
  const { saved } = await searchParams;
  const recipe = await loadRecipe(actor, id);
  const [t, history, choices] = await Promise.all([getTranslations("waxRoom.recipe"), recipeHistory(actor, id), recipeChoices(actor)]);
  const canWrite = can(actor.role, "wax:write");
  const savedKind = savedKinds.find((k) => k === saved);
  const other = choices.find((c) => c.id !== recipe.id);
  return (
    <>
      <PageHeader
        title={recipe.name}
        intro={recipe.duplicatedFrom ? t("copiedFrom", { name: recipe.duplicatedFrom.name }) : undefined}
        actions={
          <div className="flex flex-wrap items-center gap-4 text-sm">
            <Link href={waxPages.recipes} className="text-ink-700 hover:underline">
              {t("back")}
            </Link>
            {other ? (
              <Link href={waxPages.compare(recipe.id, other.id)} className="text-ink-700 hover:underline">
                {t("compareWith")}
              </Link>
            ) : null}
            {canWrite ? (
              <Link href={waxPages.editRecipe(recipe.id)} className="rounded-md bg-ink-700 px-3.5 py-2 font-medium text-white hover:bg-ink-800">
                {t("edit")}
              </Link>
            ) : null}
          </div>
        }
      />
      {savedKind ? <Notice tone="success" className="mb-4">{t(`saved.${savedKind}`)}</Notice> : null}
      {recipe.archived ? <Notice tone="warning" className="mb-4">{t("archivedNote")}</Notice> : null}
      <div className="grid gap-6 xl:grid-cols-2">
        <Panel>
          <RecipeFacts recipe={recipe} unitSystem={actor.unitSystem} />
        </Panel>
        <div className="space-y-6">
          {canWrite ? (
            <Panel title={t("duplicateTitle")} intro={t("duplicateIntro")}>
              <DuplicateForm action={duplicateRecipeAction} recipeId={recipe.id} suggestedName={t("copyName", { name: recipe.name })} season={recipe.season} />
            </Panel>
          ) : null}
          <Panel title={t("historyTitle")}>
            <ChangeHistory changes={history} testId="recipe-history" />
          </Panel>
          {canWrite ? (
            <Panel>
              <RecipeLifecycle archiveAction={archiveRecipeAction} deleteAction={deleteRecipeAction} recipe={{ id: recipe.id, name: recipe.name, version: recipe.version, archived: recipe.archived }} />
            </Panel>
          ) : null}
        </div>
      </div>
    </>
  );
}
