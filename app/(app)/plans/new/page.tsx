import type { Metadata } from "next";
import { getLocale, getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/panel";
import { newPlannerValues, type PlannerStamp } from "@/lib/contracts/plans";
import { getPlannerStamp } from "@/lib/data/plans";
import { workshopSettings } from "@/lib/data/settings";
import { AppError } from "@/lib/errors";
import { ARRANGEMENTS, type Arrangement } from "@/lib/layout";
import { can } from "@/lib/permissions";
import { requirePageActor, type Actor } from "@/lib/session";
import { z } from "@/lib/zod";
import { stampCodeSchema } from "@/lib/validation/stamps";
import { PlannerWithStamps } from "../planner";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("plans"))("newTitle") };
}

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

async function stampOrNull(actor: Actor, code: string | undefined): Promise<PlannerStamp | null> {
  const parsed = stampCodeSchema.safeParse(code);
  if (!parsed.success) return null;
  try {
    return await getPlannerStamp(actor, parsed.data);
  } catch (error) {
    if (error instanceof AppError && error.code === "notFound") return null;
    throw error;
  }
}

const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

/** The planner for a new plan, prefilled from `?stamp=<code>&borderStamp=<code>&arrangement=<arrangement>&motif=<id>`. */
export default async function NewPlanPage({ searchParams }: Props) {
  const actor = await requirePageActor();
  if (!can(actor.role, "plans:write")) return <Forbidden />;
  const params = await searchParams;
  const [t, settings, stamp, borderStamp] = await Promise.all([getTranslations("plans"), workshopSettings(), stampOrNull(actor, one(params.stamp)), stampOrNull(actor, one(params.borderStamp))]);
  const arrangement = ARRANGEMENTS.includes(one(params.arrangement) as Arrangement) ? (one(params.arrangement) as Arrangement) : undefined;
  const motif = z.uuid().safeParse(one(params.motif));
  const unknown = [one(params.stamp) && !stamp ? one(params.stamp) : null, one(params.borderStamp) && !borderStamp ? one(params.borderStamp) : null].filter(Boolean) as string[];
  const values = newPlannerValues({
    unitSystem: actor.unitSystem,
    preset: settings.clothPresets[0],
    stampCode: stamp?.code,
    // A border stamp wider than it is long runs down the selvedge turned a quarter.
    borderStamp: borderStamp ? { code: borderStamp.code, turn: borderStamp.widthMm > borderStamp.heightMm ? 90 : 0 } : undefined,
    arrangement,
    motifId: motif.success ? motif.data : undefined,
  }, await getLocale());
  return (
    <>
      <PageHeader title={t("newTitle")} intro={t("newIntro")} />
      {unknown.length ? (
        <Notice tone="warning" className="mb-4">
          {t("unknownStamps", { codes: unknown.join(", ") })}
        </Notice>
      ) : null}
      <PlannerWithStamps
        mode="new"
        initialValues={values}
        stamps={[stamp, borderStamp].filter((s): s is PlannerStamp => s !== null)}
        presets={settings.clothPresets}
        impressionsPerHour={settings.impressionsPerHour}
        unitSystem={actor.unitSystem}
        canRequestNew={can(actor.role, "stamps:requestNew")}
      />
    </>
  );
}
