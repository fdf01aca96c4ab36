import { getTranslations } from "next-intl/server";
import { Button } from "@/components/ui/button";
import { waxPages } from "@/lib/contracts/wax";

/** Two recipes to put side by side: a plain form that opens the comparison (the choice lives in the address). */
export async function CompareChooser({ recipes, a, b }: { recipes: { id: string; name: string }[]; a?: string; b?: string }) {
  const t = await getTranslations("waxRoom.recipes");
  const select = (name: "a" | "b", label: string, value: string | undefined) => (
    <label className="flex flex-col gap-1 text-sm">
      <span className="font-medium text-stone-800">{label}</span>
      <select name={name} defaultValue={value} className="rounded-md border border-stone-300 bg-white px-2 py-1.5 text-sm">
        {recipes.map((r) => (
          <option key={r.id} value={r.id}>
            {r.name}
          </option>
        ))}
      </select>
    </label>
  );
  return (
    <form method="get" action={waxPages.compareBase} className="flex flex-wrap items-end gap-3" aria-label={t("compareTitle")}>
      {select("a", t("compareA"), a ?? recipes[0]?.id)}
      {select("b", t("compareB"), b ?? recipes[1]?.id)}
      <Button type="submit" variant="secondary">
        {t("compare")}
      </Button>
    </form>
  );
}
