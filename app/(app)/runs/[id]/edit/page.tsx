import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { RunEditForm } from "@/components/runs/run-edit-form";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader, Panel } from "@/components/ui/panel";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { deleteRunAction, updateRunAction } from "../../actions";
import { loadRun } from "../load";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("runs"))("edit.title") };
}

/** The run's own fields and state; its stages are edited on the run's page, each in place. */
export default async function EditRunPage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await requirePageActor();
  if (!can(actor.role, "runs:write")) return <Forbidden />;
  const run = await loadRun(actor, (await params).id);
  const t = await getTranslations();
  return (
    <>
      <PageHeader title={`${t("runs.edit.title")} · ${run.name}`} intro={t("runs.edit.intro")} />
      <Panel>
        <RunEditForm action={updateRunAction} deleteAction={deleteRunAction} run={run} />
      </Panel>
    </>
  );
}
