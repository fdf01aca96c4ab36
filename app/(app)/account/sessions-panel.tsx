import { getTranslations } from "next-intl/server";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { Panel } from "@/components/ui/panel";
import { countActiveSessions } from "@/lib/data/sessions";
import type { Actor } from "@/lib/session";
import { signOutEverywhereAction } from "./actions";

/** How many sessions the person has, and the way to end all of them. */
export async function SessionsPanel({ actor }: { actor: Actor }) {
  const t = await getTranslations("account.sessions");
  const count = await countActiveSessions(actor);
  return (
    <Panel title={t("title")} intro={t("intro")}>
      <p className="text-sm text-stone-800" data-testid="session-count">
        {t("count", { count })}
      </p>
      <form action={signOutEverywhereAction} className="mt-3">
        <ConfirmButton variant="danger" question={t("confirm")}>
          {t("signOutEverywhere")}
        </ConfirmButton>
      </form>
    </Panel>
  );
}
