"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { useTranslations } from "next-intl";
import { cn } from "@/components/ui/cn";

const tabs = [
  { href: "/stamps", key: "stamps.tabs.stamps", exact: true },
  { href: "/stamps/pictures", key: "motifs.shelfPictures.tab" },
  { href: "/stamps/out", key: "stamps.tabs.out" },
  { href: "/stamps/locations", key: "stamps.tabs.locations" },
  { href: "/stamps/stock-takes", key: "stamps.tabs.stockTakes" },
  { href: "/stamps/requests", key: "stamps.tabs.requests" },
  { href: "/stamps/import", key: "stamps.tabs.import", writeOnly: true },
] as const;

/** The stamp shelf's own sub-navigation; hidden in print. */
export function ShelfTabs({ canWrite }: { canWrite: boolean }) {
  const t = useTranslations();
  const pathname = usePathname();
  return (
    <nav aria-label={t("stamps.tabs.label")} className="mb-6 flex flex-wrap gap-1 border-b border-stone-200 print:hidden">
      {tabs
        .filter((tab) => canWrite || !("writeOnly" in tab))
        .map((tab) => {
          const active = "exact" in tab ? pathname === tab.href || (pathname.startsWith("/stamps/") && !tabs.some((o) => o.href !== "/stamps" && pathname.startsWith(o.href))) : pathname.startsWith(tab.href);
          return (
            <Link
              key={tab.href}
              href={tab.href}
              aria-current={active ? "page" : undefined}
              className={cn("-mb-px border-b-2 px-3 py-2 text-sm font-medium", active ? "border-ink-700 text-ink-800" : "border-transparent text-stone-600 hover:text-stone-900")}
            >
              {t(tab.key)}
            </Link>
          );
        })}
    </nav>
  );
}
