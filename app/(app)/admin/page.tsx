import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader, Panel } from "@/components/ui/panel";
import { listAllApiTokens } from "@/lib/data/api-tokens";
import { listUsers } from "@/lib/data/users";
import { env } from "@/lib/env";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { AllTokens } from "./all-tokens";
import { InviteForm } from "./invite-form";
import { UsersTable } from "./users-table";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("admin"))("title") };
}

export default async function PeoplePage() {
  const actor = await requirePageActor();
  if (!can(actor.role, "users:manage")) return <Forbidden />;
  const [t, users, tokens] = await Promise.all([getTranslations("admin"), listUsers(actor), listAllApiTokens(actor)]);
  const mailViewer = env().MAIL_VIEWER_URL;
  return (
    <>
      <PageHeader
        title={t("title")}
        intro={t("intro")}
        actions={
          mailViewer ? (
            <a href={mailViewer} target="_blank" rel="noreferrer" className="text-sm text-ink-700 hover:underline">
              {t("mailViewer")}
            </a>
          ) : null
        }
      />
      <div className="space-y-6">
        <Panel title={t("invite.title")} intro={t("invite.intro")}>
          <InviteForm locale={actor.locale} />
        </Panel>
        <UsersTable users={users} selfId={actor.id} />
        <Panel title={t("tokens.title")} intro={t("tokens.intro")}>
          <AllTokens tokens={tokens} />
        </Panel>
      </div>
    </>
  );
}
