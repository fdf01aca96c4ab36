"use client";

import { useFormatter, useNow, useTranslations } from "next-intl";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { peopleUrls, type ApiTokenDto } from "@/lib/contracts/people";
import { ApiError, apiFetch } from "@/lib/swr/fetcher";
import { useApiTokens } from "@/lib/swr/use-api-tokens";

export function ApiTokens() {
  const t = useTranslations("account.tokens");
  const common = useTranslations("common");
  const format = useFormatter();
  // relativeTime measures from this moment; without one next-intl warns and guesses.
  const now = useNow({ updateInterval: 60_000 });
  const { data, error, isLoading, mutate } = useApiTokens();
  const [name, setName] = useState("");
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<ApiError | null>(null);
  const [secret, setSecret] = useState<string | null>(null);
  const [copied, setCopied] = useState(false);

  async function create(event: React.FormEvent) {
    event.preventDefault();
    setBusy(true);
    setProblem(null);
    try {
      const { token } = await apiFetch<{ token: ApiTokenDto & { secret: string } }>(peopleUrls.tokens(), { method: "POST", body: JSON.stringify({ name }) });
      setSecret(token.secret);
      setCopied(false);
      setName("");
      await mutate();
    } catch (e) {
      setProblem(e instanceof ApiError ? e : new ApiError(0, "internal", common("error")));
    } finally {
      setBusy(false);
    }
  }

  async function revoke(token: ApiTokenDto) {
    if (!window.confirm(t("revokeConfirm", { name: token.name }))) return;
    try {
      await apiFetch(peopleUrls.token(token.id), { method: "DELETE" });
      await mutate();
    } catch (e) {
      setProblem(e instanceof ApiError ? e : new ApiError(0, "internal", common("error")));
    }
  }

  return (
    <div className="space-y-4">
      <form onSubmit={create} className="flex flex-wrap items-start gap-3" noValidate>
        <div className="min-w-64 flex-1">
          <Field id="token-name" label={t("name")} errors={problem?.fields?.name}>
            {(aria) => <input {...aria} value={name} onChange={(e) => setName(e.target.value)} placeholder={t("namePlaceholder")} />}
          </Field>
        </div>
        <Button type="submit" disabled={busy} className="mt-6">
          {busy ? t("creating") : t("create")}
        </Button>
      </form>
      {problem && !problem.fields ? <Notice tone="error">{problem.message}</Notice> : null}
      {secret ? (
        <Notice tone="warning">
          <p className="font-medium">{t("createdOnce")}</p>
          <div className="mt-2 flex items-center gap-2">
            <code data-testid="new-token" className="flex-1 break-all rounded bg-white px-2 py-1 font-mono text-xs text-stone-900">
              {secret}
            </code>
            <Button
              type="button"
              variant="secondary"
              onClick={async () => {
                await navigator.clipboard?.writeText(secret);
                setCopied(true);
              }}
            >
              {copied ? t("copied") : t("copy")}
            </Button>
          </div>
        </Notice>
      ) : null}
      {isLoading ? (
        <p className="text-sm text-stone-500">{common("loading")}</p>
      ) : error ? (
        <Notice tone="error">
          {error.message}{" "}
          <button type="button" className="underline" onClick={() => mutate()}>
            {common("retry")}
          </button>
        </Notice>
      ) : data?.tokens.length ? (
        <ul className="divide-y divide-stone-100 rounded-md border border-stone-200">
          {data.tokens.map((token) => (
            <li key={token.id} className="flex flex-wrap items-center justify-between gap-3 px-4 py-2.5 text-sm">
              <div>
                <p className="font-medium text-stone-900">{token.name}</p>
                <p className="text-xs text-stone-500">
                  {t("prefix")} <code>{token.prefix}…</code> · {t("created")} {format.dateTime(new Date(token.createdAt), "date")} · {t("lastUsed")}{" "}
                  {token.lastUsedAt ? format.relativeTime(new Date(token.lastUsedAt), now) : t("never")}
                </p>
              </div>
              <Button type="button" variant="danger" className="px-2.5 py-1 text-xs" onClick={() => revoke(token)}>
                {t("revoke")}
              </Button>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-stone-500">{t("empty")}</p>
      )}
    </div>
  );
}
