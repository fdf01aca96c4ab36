import { getTranslations } from "next-intl/server";
import Link from "next/link";
import { signOutAction } from "@/lib/actions/sign-out";
import { can } from "@/lib/permissions";
import type { Actor } from "@/lib/session";
import { LanguageSwitch } from "./language-switch";
import { Logo } from "./logo";
import { NavLink } from "./nav-link";
import { navItems } from "./nav-items";

export async function AppHeader({ actor }: { actor: Actor }) {
  const t = await getTranslations();
  return (
    <header className="bg-ink-900 text-white print:hidden">
      <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2.5">
        <Link href="/" className="flex items-center gap-2 font-semibold tracking-tight">
          <Logo className="h-7 w-7" />
          {t("app.name")}
        </Link>
        <nav aria-label={t("nav.label")} className="flex flex-1 flex-wrap gap-1">
          {navItems
            .filter((item) => can(actor.role, item.permission))
            .map((item) => (
              <NavLink key={item.href} href={item.href}>
                {t(`nav.${item.labelKey}`)}
              </NavLink>
            ))}
        </nav>
        <div className="flex flex-wrap items-center gap-3 text-sm">
          <LanguageSwitch tone="dark" />
          <Link href="/account" className="text-ink-100 hover:text-white" title={t("nav.signedInAs", { name: actor.name })}>
            {actor.name} · <span className="text-ink-200">{t(`roles.${actor.role}.name`)}</span>
          </Link>
          <form action={signOutAction}>
            <button type="submit" className="rounded-md border border-ink-600 px-2.5 py-1 text-ink-100 hover:bg-ink-800 hover:text-white">
              {t("nav.signOut")}
            </button>
          </form>
        </div>
      </div>
    </header>
  );
}
