"use client";

import { useFormatter, useNow, useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { initialFormState } from "@/lib/actions/form-state";
import type { OwnedApiTokenDto } from "@/lib/contracts/people";
import { revokeTokenAction } from "./actions";

/** Everyone's live API tokens, for administrators: who owns each, when it was made and last used; revoke. */
export function AllTokens({ tokens }: { tokens: OwnedApiTokenDto[] }) {
  const t = useTranslations("admin.tokens");
  const format = useFormatter();
  const now = useNow({ updateInterval: 60_000 });
  const [state, action, pending] = useActionState(revokeTokenAction, initialFormState);
  return (
    <div className="space-y-3">
      {state.message ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null}
      {tokens.length === 0 ? (
        <p className="text-sm text-stone-500">{t("empty")}</p>
      ) : (
        <div className="overflow-x-auto rounded-md border border-stone-200">
          <table className="min-w-full divide-y divide-stone-200 text-sm" aria-label={t("title")}>
            <thead className="bg-stone-50 text-left text-stone-700">
              <tr>
                <th scope="col" className="px-3 py-2 font-semibold">{t("name")}</th>
                <th scope="col" className="px-3 py-2 font-semibold">{t("owner")}</th>
                <th scope="col" className="px-3 py-2 font-semibold">{t("created")}</th>
                <th scope="col" className="px-3 py-2 font-semibold">{t("lastUsed")}</th>
                <th scope="col" className="px-3 py-2"><span className="sr-only">{t("actions")}</span></th>
              </tr>
            </thead>
            <tbody className="divide-y divide-stone-100">
              {tokens.map((token) => (
                <tr key={token.id} data-testid={`token-row-${token.id}`}>
                  <td className="px-3 py-2">
                    <span className="font-medium text-stone-900">{token.name}</span>
                    <span className="block text-xs text-stone-500">
                      {t("prefix")} <code>{token.prefix}…</code>
                    </span>
                  </td>
                  <td className="px-3 py-2">
                    {token.owner.name}
                    <span className="block text-xs text-stone-500">
                      {token.owner.email}
                      {token.owner.disabled ? ` · ${t("ownerDisabled")}` : ""}
                    </span>
                  </td>
                  <td className="px-3 py-2 whitespace-nowrap">{format.dateTime(new Date(token.createdAt), "moment")}</td>
                  <td className="px-3 py-2 whitespace-nowrap">
                    {token.lastUsedAt ? (
                      <time dateTime={token.lastUsedAt} title={format.dateTime(new Date(token.lastUsedAt), "moment")}>
                        {format.relativeTime(new Date(token.lastUsedAt), now)}
                      </time>
                    ) : (
                      t("never")
                    )}
                  </td>
                  <td className="px-3 py-2 text-right">
                    <form
                      action={action}
                      onSubmit={(e) => {
                        if (!window.confirm(t("revokeConfirm", { name: token.name, owner: token.owner.name }))) e.preventDefault();
                      }}
                    >
                      <input type="hidden" name="id" value={token.id} />
                      <Button type="submit" variant="danger" className="px-2.5 py-1 text-xs" disabled={pending} aria-label={t("revokeOf", { name: token.name, owner: token.owner.name })}>
                        {t("revoke")}
                      </Button>
                    </form>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
