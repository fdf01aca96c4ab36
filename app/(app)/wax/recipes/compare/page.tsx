import type { Metadata } from "next";
import { getFormatter, getTranslations } from "next-intl/server";
import { Notice } from "@/components/ui/notice";
import { PageHeader, Panel } from "@/components/ui/panel";
import { rangeText, tempText } from "@/components/wax/measure";
import type { RecipeDto } from "@/lib/contracts/wax";
import { listRecipes } from "@/lib/data/wax";
import { requirePageActor } from "@/lib/session";
import { CompareChooser } from "../compare-chooser";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("waxRoom.compare"))("title") };
}

type Props = { searchParams: Promise<{ a?: string; b?: string }> };

/** Two recipes side by side: their materials lined up, the shares' difference, and the figures that follow. */
export default async function CompareWaxRecipesPage({ searchParams }: Props) {
  const actor = await requirePageActor();
  const { a, b } = await searchParams;
  const [t, tw, format, recipes] = await Promise.all([getTranslations("waxRoom.compare"), getTranslations("waxRoom"), getFormatter(), listRecipes(actor)]);
  const left = recipes.find((r) => r.id === a);
  const right = recipes.find((r) => r.id === b);
  const units = actor.unitSystem;
  const n = (v: number, digits = 2) => format.number(v, { maximumFractionDigits: digits });
  const chooser = <CompareChooser recipes={recipes.map((r) => ({ id: r.id, name: r.name }))} a={a} b={b} />;
  if (!left || !right) {
    return (
      <>
        <PageHeader title={t("title")} intro={t("intro")} />
        <Panel>
          <Notice tone="info" className="mb-4">{t("chooseTwo")}</Notice>
          {chooser}
        </Panel>
      </>
    );
  }
  const materials = [...new Map([...left.components, ...right.components].map((c) => [c.material.id, c.material.name])).entries()];
  const pct = (r: RecipeDto, id: string) => r.components.find((c) => c.material.id === id)?.pct ?? null;
  const flash = (r: RecipeDto) => (r.temperature.lowestFlashPoint ? `${r.temperature.lowestFlashPoint.name}: ${tempText(r.temperature.lowestFlashPoint.flashPointC, units, format.number)}` : tw("recipe.noFlash"));
  const rows: [string, string, string, string][] = [
    ...materials.map(([id, name]): [string, string, string, string] => {
      const l = pct(left, id);
      const r = pct(right, id);
      const diff = (r ?? 0) - (l ?? 0);
      return [name, l === null ? "—" : `${n(l)} %`, r === null ? "—" : `${n(r)} %`, diff === 0 ? "" : `${diff > 0 ? "+" : "−"}${n(Math.abs(diff))} %`];
    }),
    [t("season"), tw(`seasons.${left.season}`), tw(`seasons.${right.season}`), ""],
    [t("use"), tw(`uses.${left.use}`), tw(`uses.${right.use}`), ""],
    [t("density"), `${n(left.densityGPerCm3, 3)} g/cm³`, `${n(right.densityGPerCm3, 3)} g/cm³`, ""],
    [t("melting"), rangeText(left.meltingRangeC.fromC, left.meltingRangeC.toC, units, format.number), rangeText(right.meltingRangeC.fromC, right.meltingRangeC.toC, units, format.number), ""],
    [t("working"), rangeText(left.workingRangeC.minC, left.workingRangeC.maxC, units, format.number), rangeText(right.workingRangeC.minC, right.workingRangeC.maxC, units, format.number), ""],
    [t("lowestFlash"), flash(left), flash(right), ""],
    [t("temperature"), tw(`recipes.status.${left.temperature.status}`), tw(`recipes.status.${right.temperature.status}`), ""],
  ];
  return (
    <>
      <PageHeader title={t("title")} intro={t("intro")} />
      <div className="space-y-6">
        <Panel>{chooser}</Panel>
        <Panel>
          <table className="w-full text-left text-sm" data-testid="recipe-compare">
            <thead>
              <tr className="text-stone-900">
                <td />
                <th scope="col" className="py-1.5 font-semibold">{left.name}</th>
                <th scope="col" className="py-1.5 font-semibold">{right.name}</th>
                <th scope="col" className="py-1.5 text-xs font-medium text-stone-600">{t("difference")}</th>
              </tr>
            </thead>
            <tbody>
              {rows.map(([label, l, r, d]) => (
                <tr key={label} className="border-t border-stone-200">
                  <th scope="row" className="py-1.5 pr-3 font-medium text-stone-700">{label}</th>
                  <td className="py-1.5 pr-3">{l}</td>
                  <td className="py-1.5 pr-3">{r}</td>
                  <td className="py-1.5 text-stone-600">{d}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </Panel>
      </div>
    </>
  );
}
