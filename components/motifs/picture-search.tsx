"use client";

import Link from "next/link";
import { useTranslations } from "next-intl";
import { useRef, useState } from "react";
import { Notice } from "@/components/ui/notice";
import { scanUrls } from "@/lib/contracts/scans";
import { motifUrls } from "@/lib/contracts/motifs";
import { ApiError, apiFetch } from "@/lib/swr/fetcher";

interface Match {
  stampCode: string;
  stampName: string;
  motifId: string | null;
  distance: number;
  mirrored: boolean;
  close: boolean;
  urls: { thumb: string };
}

type Kind = "auto" | "print" | "face";

/** Drop or choose a picture; the server answers the stamps that look like it, best first. */
export function PictureSearch({ maxBytes, motifNames }: { maxBytes: number; motifNames: Record<string, string> }) {
  const t = useTranslations("motifs.picture");
  const [kind, setKind] = useState<Kind>("auto");
  const [state, setState] = useState<{ status: "idle" | "busy" | "done" | "error"; file?: string; matches?: Match[]; message?: string }>({ status: "idle" });
  const [over, setOver] = useState(false);
  const input = useRef<HTMLInputElement>(null);

  async function search(file: File) {
    setState({ status: "busy", file: file.name });
    try {
      const answer = await apiFetch<{ matches: Match[] }>(scanUrls.byPicture(kind === "auto" ? undefined : kind), {
        method: "POST",
        body: file,
        headers: { "content-type": file.type || "application/octet-stream" },
      });
      setState({ status: "done", file: file.name, matches: answer.matches });
    } catch (error) {
      setState({ status: "error", file: file.name, message: error instanceof ApiError ? error.message : String(error) });
    }
  }

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-4">
        <label className="text-sm">
          <span className="block font-medium text-stone-800">{t("kind")}</span>
          <select value={kind} onChange={(e) => setKind(e.target.value as Kind)} className="mt-1 rounded-md border border-stone-300 bg-white px-3 py-2 text-sm">
            {(["auto", "print", "face"] as const).map((k) => (
              <option key={k} value={k}>
                {t(`kinds.${k}`)}
              </option>
            ))}
          </select>
        </label>
      </div>
      <div
        data-testid="picture-drop"
        onDragOver={(e) => {
          e.preventDefault();
          setOver(true);
        }}
        onDragLeave={() => setOver(false)}
        onDrop={(e) => {
          e.preventDefault();
          setOver(false);
          const file = e.dataTransfer.files[0];
          if (file) void search(file);
        }}
        className={`flex flex-col items-center justify-center gap-2 rounded-lg border-2 border-dashed p-8 text-center text-sm ${over ? "border-ink-500 bg-ink-50" : "border-stone-300 bg-white"}`}
      >
        <p className="text-stone-700">{t("drop")}</p>
        <label className="cursor-pointer rounded-md bg-ink-700 px-3.5 py-2 font-medium text-white hover:bg-ink-800">
          {t("choose")}
          <input
            ref={input}
            type="file"
            accept="image/png,image/jpeg,image/webp"
            className="sr-only"
            onChange={(e) => {
              const file = e.target.files?.[0];
              if (file) void search(file);
              if (input.current) input.current.value = "";
            }}
          />
        </label>
        <p className="text-xs text-stone-500">{t("limits", { mb: Math.round(maxBytes / (1024 * 1024)) })}</p>
      </div>
      {state.status === "busy" ? <p className="text-sm text-stone-600" role="status">{t("searching")}</p> : null}
      {state.status === "error" ? <Notice tone="error">{state.message}</Notice> : null}
      {state.status === "done" ? (
        <section aria-label={t("results", { file: state.file ?? "" })}>
          <h2 className="mb-2 text-sm font-semibold text-stone-900">{t("results", { file: state.file ?? "" })}</h2>
          {state.matches!.length === 0 ? (
            <p className="text-sm text-stone-600">{t("none")}</p>
          ) : (
            <ol className="grid grid-cols-2 gap-3 sm:grid-cols-4 lg:grid-cols-6" data-testid="picture-matches">
              {state.matches!.map((m) => (
                <li key={m.stampCode} className="text-xs">
                  <Link href={`/stamps/${encodeURIComponent(m.stampCode)}`} className="group block">
                    {/* eslint-disable-next-line @next/next/no-img-element -- thumbnails come from our API */}
                    <img src={m.urls.thumb} alt="" className="aspect-square w-full rounded border border-stone-200 bg-stone-100 object-contain group-hover:border-ink-400" />
                    <span className="mt-1 block font-mono text-ink-700 group-hover:underline" data-testid="match-code">
                      {m.stampCode}
                    </span>
                    <span className="block truncate text-stone-600">{m.stampName}</span>
                  </Link>
                  <span className="block text-stone-600">
                    {t("alike", { alike: 1 - m.distance })}
                    {m.close ? null : ` · ${t("loose")}`}
                  </span>
                  {m.mirrored ? (
                    <span className="mt-0.5 inline-block rounded bg-soga-50 px-1 text-soga-700" title={t("mirrorHint")}>
                      {t("mirror")}
                    </span>
                  ) : null}
                  {m.motifId ? (
                    <Link href={motifUrls.page(m.motifId)} className="block text-ink-700 hover:underline">
                      {t("motif", { name: motifNames[m.motifId] ?? "…" })}
                    </Link>
                  ) : (
                    <span className="block text-stone-500">{t("noMotif")}</span>
                  )}
                </li>
              ))}
            </ol>
          )}
        </section>
      ) : null}
    </div>
  );
}
