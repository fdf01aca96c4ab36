import { getFormatter, getTranslations } from "next-intl/server";
import type { RecipeDto, UnitSystem } from "@/lib/contracts/wax";
import { rangeText, tempText } from "./measure";
import { NoteText } from "./wax-note";

/** What a recipe is: season, purpose, the mix by mass %, density, melting and working range (°C and °F), the flash-point rule. */
export async function RecipeFacts({ recipe, unitSystem }: { recipe: RecipeDto; unitSystem: UnitSystem }) {
  const [t, format] = await Promise.all([getTranslations("waxRoom"), getFormatter()]);
  const n = (v: number, digits = 1) => format.number(v, { maximumFractionDigits: digits });
  const temp = recipe.temperature;
  const facts: [string, React.ReactNode][] = [
    [t("recipes.season"), t(`seasons.${recipe.season}`)],
    [t("recipes.use"), t(`uses.${recipe.use}`)],
    [t("recipe.density"), t("recipe.densityValue", { density: n(recipe.densityGPerCm3, 3) })],
    [t("recipe.melting"), rangeText(recipe.meltingRangeC.fromC, recipe.meltingRangeC.toC, unitSystem, format.number)],
    [
      t("recipe.working"),
      <span key="w" data-testid="recipe-working-range">
        {`${n(recipe.workingRangeC.minC)}–${n(recipe.workingRangeC.maxC)} °C · ${n(recipe.workingRangeF.minF)}–${n(recipe.workingRangeF.maxF)} °F`}
      </span>,
    ],
    [t("recipe.lowestFlash"), temp.lowestFlashPoint ? t("recipe.lowestFlashValue", { material: temp.lowestFlashPoint.name, flash: tempText(temp.lowestFlashPoint.flashPointC, unitSystem, format.number) }) : t("recipe.noFlash")],
    [t("recipe.temperature"), <span key="s" className={temp.status === "ok" ? "text-emerald-800" : "font-medium text-amber-800"}>{t(`recipes.status.${temp.status}`)}</span>],
  ];
  return (
    <div className="space-y-4 text-sm">
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1.5">
        {facts.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="text-stone-600">{k}</dt>
            <dd className="text-stone-900">{v}</dd>
          </div>
        ))}
      </dl>
      <table className="w-full text-left" data-testid="recipe-components">
        <caption className="pb-1 text-left text-sm font-semibold text-stone-900">{t("recipe.components")}</caption>
        <thead className="text-xs text-stone-600">
          <tr>
            <th scope="col" className="py-1 font-medium">{t("recipe.material")}</th>
            <th scope="col" className="py-1 text-right font-medium">{t("recipe.pct")}</th>
          </tr>
        </thead>
        <tbody>
          {recipe.components.map((c) => (
            <tr key={c.line} className="border-t border-stone-200">
              <td className="py-1">{c.material.name}</td>
              <td className="py-1 text-right">{n(c.pct, 2)} %</td>
            </tr>
          ))}
        </tbody>
      </table>
      {temp.problem || temp.warnings.length ? (
        <ul className="space-y-1 text-amber-900" data-testid="recipe-warnings">
          {[...(temp.problem ? [temp.problem] : []), ...temp.warnings].map((w, i) => (
            <li key={i}>
              <NoteText note={w} />
            </li>
          ))}
        </ul>
      ) : null}
      <div>
        <h3 className="font-semibold text-stone-900">{t("recipe.notes")}</h3>
        <p className="mt-1 whitespace-pre-line text-stone-700">{recipe.notes || t("recipe.noNotes")}</p>
      </div>
      <p className="text-xs text-stone-600">{t("recipe.usage", { estimates: recipe.usage.estimates, uses: recipe.usage.uses })}</p>
    </div>
  );
}
