import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader, Panel } from "@/components/ui/panel";
import { RecipeForm } from "@/components/wax/recipe-form";
import { listMaterials } from "@/lib/data/wax";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { createRecipeAction } from "../../actions";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("waxRoom.recipe"))("newTitle") };
}

export default async function NewWaxRecipePage() {
  const actor = await requirePageActor();
  if (!can(actor.role, "wax:write")) return <Forbidden />;
  const [t, materials] = await Promise.all([getTranslations("waxRoom.recipe"), listMaterials(actor)]);
  return (
    <>
      <PageHeader title={t("newTitle")} />
      <Panel>
        <RecipeForm
          action={createRecipeAction}
          mode="create"
          initial={{ name: "", season: "any", use: "stamping", components: [], workingRangeC: { minC: null, maxC: null }, notes: null }}
          materials={materials.map((m) => ({ id: m.id, name: m.name, flashPointC: m.flashPointC }))}
          unitSystem={actor.unitSystem}
        />
      </Panel>
    </>
  );
}
