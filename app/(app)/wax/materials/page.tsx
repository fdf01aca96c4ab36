import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { PageHeader, Panel } from "@/components/ui/panel";
import { MaterialForm } from "@/components/wax/material-form";
import { getWaxDefaults, listMaterials } from "@/lib/data/wax";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { createMaterialAction } from "../actions";
import { MaterialsTable } from "./materials-table";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("waxRoom.materials"))("title") };
}

export default async function WaxMaterialsPage() {
  const actor = await requirePageActor();
  const [t, materials, defaults] = await Promise.all([getTranslations("waxRoom.materials"), listMaterials(actor), getWaxDefaults(actor)]);
  return (
    <>
      <PageHeader title={t("title")} intro={t("intro")} />
      <div className="space-y-6">
        <Panel>
          <MaterialsTable materials={materials} unitSystem={actor.unitSystem} currency={defaults.currency} />
        </Panel>
        {can(actor.role, "wax:write") ? (
          <Panel title={t("addTitle")}>
            <MaterialForm action={createMaterialAction} material={null} unitSystem={actor.unitSystem} currency={defaults.currency} />
          </Panel>
        ) : null}
      </div>
    </>
  );
}
