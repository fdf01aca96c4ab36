"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { cn } from "@/components/ui/cn";

/** An area's own sub-navigation (labels already translated); the longest matching address is the current tab. */
export function AreaTabs({ label, tabs }: { label: string; tabs: { href: string; label: string }[] }) {
  const pathname = usePathname();
  const current = tabs
    .filter((tab) => pathname === tab.href || pathname.startsWith(`${tab.href}/`))
    .sort((a, b) => b.href.length - a.href.length)[0]?.href;
  return (
    <nav aria-label={label} className="mb-6 flex flex-wrap gap-1 border-b border-stone-200 print:hidden">
      {tabs.map((tab) => (
        <Link
          key={tab.href}
          href={tab.href}
          aria-current={tab.href === current ? "page" : undefined}
          className={cn("-mb-px border-b-2 px-3 py-2 text-sm font-medium", tab.href === current ? "border-ink-700 text-ink-800" : "border-transparent text-stone-600 hover:text-stone-900")}
        >
          {tab.label}
        </Link>
      ))}
    </nav>
  );
}
