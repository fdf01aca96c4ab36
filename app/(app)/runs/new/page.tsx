import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { getTranslations } from "next-intl/server";
import { RunForm } from "@/components/runs/run-form";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader, Panel } from "@/components/ui/panel";
import { runPages } from "@/lib/contracts/runs";
import { getMotif, listMotifs, plansOfMotif } from "@/lib/data/motifs";
import { workshopSettings, workshopToday } from "@/lib/data/settings";
import { listRecipes, planChoices } from "@/lib/data/wax";
import { AppError } from "@/lib/errors";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { z } from "@/lib/zod";
import { createRunAction } from "../actions";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("runs"))("form.title") };
}

type Props = { searchParams: Promise<{ motif?: string; colourway?: string; plan?: string }> };

/** A new run: first the motif (from the archive), then its colourway, cloth, size, days, plan and recipe. */
export default async function NewRunPage({ searchParams }: Props) {
  const actor = await requirePageActor();
  if (!can(actor.role, "runs:write")) return <Forbidden />;
  const { motif: motifId, colourway, plan } = await searchParams;
  const t = await getTranslations();
  if (!motifId) {
    const { motifs } = await listMotifs(actor, { sort: "lastUsed", page: 1, pageSize: 200 });
    const withColourways = motifs.filter((m) => m.colourwayCount > 0);
    return (
      <>
        <PageHeader title={t("runs.form.title")} intro={t("runs.form.pickMotif")} />
        <Panel>
          {withColourways.length === 0 ? (
            <p className="text-sm text-stone-600">{t("runs.form.noMotifs")}</p>
          ) : (
            <ul className="grid gap-2 sm:grid-cols-2 lg:grid-cols-3" data-testid="run-motif-choices">
              {withColourways.map((m) => (
                <li key={m.id}>
                  <Link href={runPages.new({ motif: m.id })} className="block rounded-md border border-stone-200 px-3 py-2 text-sm hover:border-ink-500">
                    <span className="font-medium text-stone-900">{m.name}</span>
                    <span className="block text-xs text-stone-600">{t("motifs.card.colourways", { count: m.colourwayCount })}</span>
                  </Link>
                </li>
              ))}
            </ul>
          )}
        </Panel>
      </>
    );
  }
  if (!z.uuid().safeParse(motifId).success) notFound();
  const motif = await getMotif(actor, motifId).catch((error) => {
    if (error instanceof AppError && error.code === "notFound") notFound();
    throw error;
  });
  const [motifPlans, allPlans, recipes, settings, today] = await Promise.all([plansOfMotif(actor, motif.id), planChoices(actor), listRecipes(actor), workshopSettings(), workshopToday()]);
  const ownIds = new Set(motifPlans.map((p) => p.id));
  const plans = [...motifPlans.map((p) => ({ id: p.id, name: p.name })), ...allPlans.filter((p) => !ownIds.has(p.id))];
  return (
    <>
      <PageHeader title={t("runs.form.title")} intro={t("runs.form.intro", { motif: motif.name })} />
      <Panel>
        {motif.colourways.length === 0 ? (
          <p className="text-sm text-stone-600">{t("runs.form.noColourways")}</p>
        ) : (
          <RunForm
            action={createRunAction}
            motif={{ id: motif.id, name: motif.name, colourways: motif.colourways.map((c) => ({ id: c.id, name: c.name, colours: c.colours.length })) }}
            colourwayId={motif.colourways.some((c) => c.id === colourway) ? colourway! : motif.colourways[0].id}
            plans={plans}
            planId={plan && plans.some((p) => p.id === plan) ? plan : (motifPlans[0]?.id ?? "")}
            recipes={recipes.map((r) => ({ id: r.id, name: r.name }))}
            cloths={settings.clothPresets.map((c) => c.name)}
            today={today}
          />
        )}
      </Panel>
    </>
  );
}
