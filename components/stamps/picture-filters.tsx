"use client";

import { useTranslations } from "next-intl";
import { StampFilters } from "@/components/stamps/stamp-filters";
import { useDebouncedParam, useUrlParams } from "@/components/ui/use-url-params";
import type { LocationDto } from "@/lib/contracts/stamps";
import type { UnitSystem } from "@/lib/stamps/format";
import { stampFilterKeys } from "@/lib/validation/stamps";

/**
 * The filters of the shelf's picture view: the table's own filter controls (the same keys, stampFilterKeys), kept in
 * the address; the page is drawn by the server from that address, so each change asks it to draw the cards again.
 */
export function PictureFilters({ locations, sites, unitSystem, refused }: { locations: LocationDto[]; sites: string[]; unitSystem: UnitSystem; refused: Record<string, string[]> }) {
  const t = useTranslations();
  const url = useUrlParams({ server: true });
  const [search, setSearch] = useDebouncedParam(url, "q");
  const filtered = stampFilterKeys.some((k) => url.params.get(k));
  return (
    <div className="mb-4 space-y-1" aria-busy={url.pending || undefined}>
      <StampFilters url={url} search={search} setSearch={setSearch} locations={locations} sites={sites} unitSystem={unitSystem} refused={refused} filtered={filtered} />
      <p className="min-h-5 text-xs text-stone-500" aria-live="polite">
        {url.pending ? t("stamps.table.updating") : ""}
      </p>
    </div>
  );
}
