import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { getFormatter, getTranslations } from "next-intl/server";
import { Notice } from "@/components/ui/notice";
import { PageHeader, Panel } from "@/components/ui/panel";
import { ChangeHistory } from "@/components/wax/change-history";
import { MaterialForm, MovementForm } from "@/components/wax/material-form";
import { kgText, rangeText, tempText } from "@/components/wax/measure";
import { NoteText } from "@/components/wax/wax-note";
import type { Actor } from "@/lib/authz";
import { waxPages, type MaterialDetailDto } from "@/lib/contracts/wax";
import { getMaterial, getWaxDefaults, listMovements, materialHistory } from "@/lib/data/wax";
import { AppError } from "@/lib/errors";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { z } from "@/lib/zod";
import { recordMovementAction, updateMaterialAction } from "../../actions";

type Props = { params: Promise<{ id: string }>; searchParams: Promise<{ saved?: string }> };

async function load(actor: Actor, id: string): Promise<MaterialDetailDto> {
  if (!z.uuid().safeParse(id).success) notFound();
  try {
    return await getMaterial(actor, id);
  } catch (error) {
    if (error instanceof AppError && error.code === "notFound") notFound();
    throw error;
  }
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const actor = await requirePageActor();
  return { title: (await load(actor, (await params).id)).name };
}

/** One material: its figures with their sources, the recipes its flash point now refuses, stock movements, history. */
export default async function WaxMaterialPage({ params, searchParams }: Props) {
  const actor = await requirePageActor();
  const { id } = await params;
  const { saved } = await searchParams;
  const material = await load(actor, id);
  const [t, tl, tm, format, movements, history, defaults] = await Promise.all([
    getTranslations("waxRoom.material"),
    getTranslations("waxRoom.materials"),
    getTranslations("waxRoom.movement"),
    getFormatter(),
    listMovements(actor, id),
    materialHistory(actor, id),
    getWaxDefaults(actor),
  ]);
  const units = actor.unitSystem;
  const canWrite = can(actor.role, "wax:write");
  const money = (v: number) => format.number(v, { style: "currency", currency: defaults.currency, maximumFractionDigits: defaults.currency === "IDR" ? 0 : 2 });
  const rows: [string, React.ReactNode, string][] = [
    [tl("density"), `${format.number(material.densityGPerCm3, { maximumFractionDigits: 3 })} g/cm³`, material.sources.density],
    [tl("melting"), rangeText(material.meltingRangeC.fromC, material.meltingRangeC.toC, units, format.number), material.sources.melting],
    [tl("flashPoint"), material.flashPointC === null ? <span className="text-amber-800">{tl("unknown")}</span> : tempText(material.flashPointC, units, format.number), material.sources.flashPoint],
    [t("discolours"), material.discoloursAboveC === null ? "—" : tempText(material.discoloursAboveC, units, format.number), ""],
    [tl("price"), material.pricePerKg === null ? "—" : tl("perUnit", { price: money(material.pricePerKg), unit: "kg" }), material.sources.price ?? ""],
    [tl("reorderLevel"), kgText(material.reorderLevelKg, units, format.number), ""],
  ];
  return (
    <>
      <PageHeader
        title={material.name}
        actions={
          <Link href={waxPages.materials} className="text-sm text-ink-700 hover:underline">
            {t("back")}
          </Link>
        }
      />
      {saved === "created" ? <Notice tone="success" className="mb-4">{t("created")}</Notice> : null}
      <div className="grid gap-6 xl:grid-cols-2">
        <Panel title={t("facts")}>
          <table className="w-full text-left text-sm" data-testid="material-facts">
            <thead className="text-xs text-stone-600">
              <tr>
                <th scope="col" className="py-1 font-medium">{t("figure")}</th>
                <th scope="col" className="py-1 font-medium">{t("value")}</th>
                <th scope="col" className="py-1 font-medium">{t("source")}</th>
              </tr>
            </thead>
            <tbody>
              {rows.map(([name, value, source]) => (
                <tr key={name} className="border-t border-stone-200 align-top">
                  <th scope="row" className="py-1.5 pr-3 font-medium text-stone-800">{name}</th>
                  <td className="py-1.5 pr-3">{value}</td>
                  <td className="py-1.5 text-xs text-stone-600">{source || "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </Panel>
        <Panel title={t("recipeChecksTitle")}>
          {material.recipeChecks.length ? (
            <ul className="space-y-2 text-sm" data-testid="material-recipe-checks">
              {material.recipeChecks.map((c) => (
                <li key={c.recipeId}>
                  <Notice tone={c.status === "tooNear" ? "error" : "warning"}>
                    <Link href={waxPages.recipe(c.recipeId)} className="font-medium underline">
                      {c.recipeName}
                    </Link>
                    : <NoteText note={c.problem} />
                  </Notice>
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-sm text-stone-600" data-testid="material-recipe-checks">
              {t("recipeChecksNone")}
            </p>
          )}
        </Panel>
        <Panel title={t("stockTitle")} intro={<span data-testid="material-on-hand">{t("onHand", { amount: kgText(material.onHandKg, units, format.number, 3) })}</span>}>
          {canWrite ? (
            <div className="mb-5">
              <MovementForm action={recordMovementAction} materialId={material.id} unitSystem={units} />
            </div>
          ) : null}
          <h3 className="text-sm font-semibold text-stone-900">{t("movementsTitle")}</h3>
          {movements.length ? (
            <table className="mt-2 w-full text-left text-sm" data-testid="material-movements">
              <thead className="text-xs text-stone-600">
                <tr>
                  <th scope="col" className="py-1 font-medium">{tm("at")}</th>
                  <th scope="col" className="py-1 font-medium">{tm("kind")}</th>
                  <th scope="col" className="py-1 text-right font-medium">{tm("kg")}</th>
                  <th scope="col" className="py-1 pl-3 font-medium">{tm("note")}</th>
                  <th scope="col" className="py-1 font-medium">{tm("by")}</th>
                </tr>
              </thead>
              <tbody>
                {movements.map((m) => (
                  <tr key={m.id} className="border-t border-stone-200">
                    <td className="py-1">{format.dateTime(new Date(m.at), "moment")}</td>
                    <td className="py-1">{tm(`kinds.${m.kind}`)}</td>
                    <td className="py-1 text-right">{kgText(m.kg, units, format.number, 3)}</td>
                    <td className="py-1 pl-3 text-stone-600">{m.note ?? ""}</td>
                    <td className="py-1 text-stone-600">{m.actorName}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : (
            <p className="mt-2 text-sm text-stone-600">{t("movementsEmpty")}</p>
          )}
        </Panel>
        <Panel title={t("historyTitle")}>
          <ChangeHistory changes={history} testId="material-history" />
        </Panel>
        {canWrite ? (
          <Panel title={t("editTitle")} className="xl:col-span-2">
            <MaterialForm action={updateMaterialAction} material={material} unitSystem={units} currency={defaults.currency} />
          </Panel>
        ) : null}
      </div>
    </>
  );
}
