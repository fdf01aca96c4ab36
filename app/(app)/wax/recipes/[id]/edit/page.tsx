import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader, Panel } from "@/components/ui/panel";
import { RecipeForm } from "@/components/wax/recipe-form";
import { listMaterials } from "@/lib/data/wax";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { updateRecipeAction } from "../../../actions";
import { loadRecipe } from "../../load";

type Props = { params: Promise<{ id: string }> };

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("waxRoom.recipe"))("editTitle") };
}

export default async function EditWaxRecipePage({ params }: Props) {
  const actor = await requirePageActor();
  const recipe = await loadRecipe(actor, (await params).id);
  if (!can(actor.role, "wax:write")) return <Forbidden />;
  const [t, materials] = await Promise.all([getTranslations("waxRoom.recipe"), listMaterials(actor)]);
  return (
    <>
      <PageHeader title={`${t("editTitle")}: ${recipe.name}`} />
      <Panel>
        <RecipeForm
          action={updateRecipeAction}
          mode="edit"
          initial={{
            id: recipe.id,
            name: recipe.name,
            season: recipe.season,
            use: recipe.use,
            components: recipe.components.map((c) => ({ material: c.material.id, pct: c.pct })),
            workingRangeC: recipe.workingRangeC,
            notes: recipe.notes,
            version: recipe.version,
          }}
          materials={materials.map((m) => ({ id: m.id, name: m.name, flashPointC: m.flashPointC }))}
          unitSystem={actor.unitSystem}
        />
      </Panel>
    </>
  );
}
