import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { StampForm } from "@/components/stamps/stamp-form";
import { PageHeader, Panel } from "@/components/ui/panel";
import { listLocations } from "@/lib/data/stamps/locations";
import { getStamp } from "@/lib/data/stamps";
import { AppError } from "@/lib/errors";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { stampCodeSchema } from "@/lib/validation/stamps";
import { updateStampAction } from "../../actions";
import { locationLabel } from "@/lib/stamps/format";

type Props = { params: Promise<{ code: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { code } = await params;
  return { title: (await getTranslations("stamps"))("form.editTitleOf", { code: decodeURIComponent(code).toUpperCase() }) };
}

export default async function EditStampPage({ params }: Props) {
  const actor = await requirePageActor();
  if (!can(actor.role, "stamps:write")) return <Forbidden />;
  const code = stampCodeSchema.safeParse(decodeURIComponent((await params).code));
  if (!code.success) notFound();
  const stamp = await getStamp(actor, code.data).catch((error) => {
    if (error instanceof AppError && error.code === "notFound") notFound();
    throw error;
  });
  const [t, locations] = await Promise.all([getTranslations(), listLocations(actor)]);
  return (
    <>
      <PageHeader title={t("stamps.form.editTitleOf", { code: stamp.code })} intro={stamp.name} />
      <Panel>
        <StampForm
          action={updateStampAction}
          mode="edit"
          unitSystem={actor.unitSystem}
          locations={locations.map((l) => ({ id: l.id, label: locationLabel(l) }))}
          initial={{ ...stamp, twinCode: stamp.twin?.code ?? null, locationId: stamp.location?.id ?? null }}
        />
      </Panel>
    </>
  );
}
