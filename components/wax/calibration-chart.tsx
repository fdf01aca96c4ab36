"use client";

import { useFormatter, useTranslations } from "next-intl";
import { useState, useSyncExternalStore } from "react";
import { CartesianGrid, Legend, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis } from "recharts";
import type { RecipeCalibrationDto } from "@/lib/contracts/wax";

const noSubscription = () => () => {};

/**
 * The calibration of one recipe as a picture: each recorded use (waxed area m² against grams of wax), the line the
 * fit draws through the origin (its slope is the calibrated rate, g/m²) and the default rate for comparison.
 * Drawn in the browser only: the chart library lays itself out with inline styles, which the pages' CSP refuses in
 * server-rendered HTML; a table of the same numbers stands beside it for screen readers.
 */
export function CalibrationChart({ recipes, defaultRateGPerM2, minUses }: { recipes: RecipeCalibrationDto[]; defaultRateGPerM2: number; minUses: number }) {
  const t = useTranslations("waxRoom.calibration");
  const format = useFormatter();
  const mounted = useSyncExternalStore(noSubscription, () => true, () => false);
  const [recipeId, setRecipeId] = useState(recipes[0]?.recipeId ?? "");
  const recipe = recipes.find((r) => r.recipeId === recipeId) ?? recipes[0];
  if (!recipe) return <p className="text-sm text-stone-600">{t("noUses")}</p>;

  const n = (v: number, digits = 1) => format.number(v, { maximumFractionDigits: digits });
  const maxX = Math.max(...recipe.points.map((p) => p.areaM2), 1) * 1.1;
  const fitLine = [
    { areaM2: 0, grams: 0 },
    { areaM2: maxX, grams: recipe.fit.rateGPerM2 * maxX },
  ];
  const defaultLine = [
    { areaM2: 0, grams: 0 },
    { areaM2: maxX, grams: defaultRateGPerM2 * maxX },
  ];
  const se = recipe.fit.standardErrorGPerM2;
  return (
    <div className="space-y-3">
      <label className="flex flex-wrap items-center gap-2 text-sm">
        <span className="font-medium text-stone-800">{t("recipe")}</span>
        <select className="rounded-md border border-stone-300 bg-white px-2 py-1 text-sm" value={recipe.recipeId} onChange={(e) => setRecipeId(e.target.value)} data-testid="calibration-recipe">
          {recipes.map((r) => (
            <option key={r.recipeId} value={r.recipeId}>
              {r.recipeName}
            </option>
          ))}
        </select>
      </label>
      <p className="text-sm text-stone-800" data-testid="calibrated-rate">
        {recipe.enoughUses
          ? se !== null
            ? t("rateWithSpread", { rate: n(recipe.fit.rateGPerM2), se: n(se), uses: recipe.fit.uses })
            : t("rate", { rate: n(recipe.fit.rateGPerM2), uses: recipe.fit.uses })
          : t("notEnough", { uses: recipe.fit.uses, minUses, rate: n(recipe.fit.rateGPerM2) })}
      </p>
      {recipe.cloths.length ? (
        <ul className="text-xs text-stone-600">
          {recipe.cloths.map((c) => (
            <li key={c.cloth}>{t("cloth", { cloth: c.cloth, rate: n(c.fit.rateGPerM2), uses: c.fit.uses })}</li>
          ))}
        </ul>
      ) : null}
      <div className="h-80 w-full" data-testid="calibration-chart" data-points={recipe.points.length} data-rate={recipe.fit.rateGPerM2.toFixed(3)}>
        {mounted ? (
          <ResponsiveContainer width="100%" height="100%">
            <ScatterChart margin={{ top: 10, right: 20, bottom: 30, left: 20 }}>
              <CartesianGrid stroke="#e7e5e4" />
              <XAxis type="number" dataKey="areaM2" name={t("axisArea")} domain={[0, Math.ceil(maxX)]} label={{ value: t("axisArea"), position: "insideBottom", offset: -15 }} />
              <YAxis type="number" dataKey="grams" name={t("axisGrams")} label={{ value: t("axisGrams"), angle: -90, position: "insideLeft" }} />
              <Tooltip formatter={(value) => n(Number(value), 1)} />
              <Legend verticalAlign="top" />
              <Scatter name={t("uses")} data={recipe.points} fill="#9a3412" />
              <Scatter name={t("fitLine")} data={fitLine} line={{ stroke: "#1c1917", strokeWidth: 2 }} shape={() => <g />} legendType="line" fill="#1c1917" />
              <Scatter name={t("defaultLine", { rate: n(defaultRateGPerM2) })} data={defaultLine} line={{ stroke: "#78716c", strokeDasharray: "5 4" }} shape={() => <g />} legendType="plainline" fill="#78716c" />
            </ScatterChart>
          </ResponsiveContainer>
        ) : null}
      </div>
      <table className="sr-only">
        <caption>{t("tableCaption", { recipe: recipe.recipeName })}</caption>
        <thead>
          <tr>
            <th scope="col">{t("day")}</th>
            <th scope="col">{t("axisArea")}</th>
            <th scope="col">{t("axisGrams")}</th>
          </tr>
        </thead>
        <tbody>
          {recipe.points.map((p) => (
            <tr key={p.useId}>
              <td>{p.usedOn}</td>
              <td>{n(p.areaM2, 2)}</td>
              <td>{n(p.grams, 0)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
