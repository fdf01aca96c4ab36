import { getTranslations } from "next-intl/server";
import type { OverviewDto } from "@/lib/contracts/overview";
import { motifUrls } from "@/lib/contracts/motifs";
import { runPages } from "@/lib/contracts/runs";
import { OverviewPanel } from "./overview-panel";
import Link from "next/link";

// The designers' panel: the motifs' colourways that runs being prepared or in work carry, with those runs.

type Props<K extends keyof OverviewDto> = { data: NonNullable<OverviewDto[K]> };

export async function ColourwaysInWorkPanel({ data }: Props<"colourwaysInWork">) {
  const t = await getTranslations();
  return (
    <OverviewPanel
      section="colourwaysInWork"
      title={t("overview.colourwaysInWork.title")}
      intro={t("overview.colourwaysInWork.intro")}
      total={data.total}
      shown={data.items.length}
      empty={t("overview.colourwaysInWork.empty")}
      moreHref={runPages.list()}
    >
      <ul className="divide-y divide-stone-100">
        {data.items.map((c) => (
          <li key={c.colourway.id} className="py-2" data-testid={`colourway-${c.colourway.id}`}>
            <Link href={motifUrls.page(c.motif.id)} className="font-medium text-ink-700 hover:underline">
              {c.motif.name} · {c.colourway.name}
            </Link>{" "}
            <span className="text-stone-600">{t("overview.colourwaysInWork.runs", { count: c.runs.length })}</span>
            <ul className="mt-1 space-y-0.5 pl-4">
              {c.runs.map((r) => (
                <li key={r.id}>
                  <Link href={runPages.one(r.id)} className="text-ink-700 hover:underline">
                    {r.name}
                  </Link>{" "}
                  <span className="text-stone-600">· {t(`runs.state.${r.state}`)}</span>
                </li>
              ))}
            </ul>
          </li>
        ))}
      </ul>
    </OverviewPanel>
  );
}
