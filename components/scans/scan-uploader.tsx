"use client";

import { useRef, useState, useSyncExternalStore } from "react";
import { useTranslations } from "next-intl";
import { Button } from "@/components/ui/button";
import { cn } from "@/components/ui/cn";
import type { ScanDto, ScanUpload } from "@/lib/contracts/scans";
import { ApiError, apiFetch } from "@/lib/swr/fetcher";
import { scansKey } from "@/lib/swr/use-scans";
import { DPI_MAX, DPI_MIN, scanKinds, type ScanKindValue } from "@/lib/validation/scans";

type Status = "waiting" | "uploading" | "processing" | "done" | "failed";

interface Item {
  id: number;
  file: File;
  status: Status;
  /** 0…1 of the bytes sent to the store. */
  progress: number;
  error: string | null;
  /** Kind and DPI as chosen when the file was added. */
  kind: ScanKindValue;
  dpi: number | null;
}

class PutFailed extends Error {
  constructor(readonly status: number) {
    super(`PUT ${status}`);
  }
}

/** PUT straight to the store with upload progress (fetch reports none), as the presigned URL allows. */
function putWithProgress(upload: ScanUpload, file: File, onProgress: (share: number) => void): Promise<void> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open(upload.method, upload.url);
    for (const [name, value] of Object.entries(upload.headers)) xhr.setRequestHeader(name, value);
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => (xhr.status >= 200 && xhr.status < 300 ? resolve() : reject(new PutFailed(xhr.status)));
    xhr.onerror = () => reject(new PutFailed(0));
    xhr.send(file);
  });
}

/**
 * Drop or pick scan files; each goes to the store by a presigned PUT with its own progress bar, then the
 * server checks and measures it. Files go one after another, so a batch does not crowd the server's queue.
 */
const noSubscription = () => () => {};

export function ScanUploader({ code, maxBytes, onStored }: { code: string; maxBytes: number; onStored: (scan: ScanDto) => void }) {
  const t = useTranslations("scans");
  const [items, setItems] = useState<Item[]>([]);
  // False in the server HTML and until React has hydrated: a file picked before then would be lost.
  const hydrated = useSyncExternalStore(noSubscription, () => true, () => false);
  const [kind, setKind] = useState<ScanKindValue>("print");
  const [dpi, setDpi] = useState("");
  const [dragging, setDragging] = useState(false);
  const nextId = useRef(1);
  const running = useRef(false);
  const queue = useRef<Item[]>([]);

  const update = (id: number, patch: Partial<Item>) => setItems((list) => list.map((item) => (item.id === id ? { ...item, ...patch } : item)));

  async function send(item: Item) {
    try {
      update(item.id, { status: "uploading", progress: 0 });
      const { upload } = await apiFetch<{ upload: ScanUpload }>(`${scansKey(code)}/uploads`, {
        method: "POST",
        body: JSON.stringify({ fileName: item.file.name, sizeBytes: item.file.size }),
      });
      await putWithProgress(upload, item.file, (share) => update(item.id, { progress: share }));
      update(item.id, { status: "processing", progress: 1 });
      const { scan } = await apiFetch<{ scan: ScanDto }>(scansKey(code), {
        method: "POST",
        body: JSON.stringify({ uploadKey: upload.key, fileName: item.file.name, kind: item.kind, dpi: item.dpi }),
      });
      update(item.id, { status: "done" });
      onStored(scan);
    } catch (error) {
      const message =
        error instanceof ApiError
          ? [error.message, ...Object.values(error.fields ?? {}).flat()].join(" ")
          : error instanceof PutFailed
            ? error.status === 0
              ? t("upload.networkFailed")
              : t("upload.uploadFailed", { status: error.status })
            : t("upload.networkFailed");
      update(item.id, { status: "failed", error: message });
    }
  }

  async function drain() {
    if (running.current) return;
    running.current = true;
    while (queue.current.length > 0) await send(queue.current.shift()!);
    running.current = false;
  }

  function add(files: FileList | File[] | null) {
    if (!files || files.length === 0) return;
    const dpiValue = dpi.trim() === "" ? null : Number(dpi);
    const added: Item[] = Array.from(files).map((file) => ({ id: nextId.current++, file, status: "waiting", progress: 0, error: null, kind, dpi: dpiValue }));
    setItems((list) => [...list, ...added]);
    queue.current.push(...added);
    void drain();
  }

  const dpiInvalid = dpi.trim() !== "" && !(Number(dpi) >= DPI_MIN && Number(dpi) <= DPI_MAX);

  return (
    <div className="space-y-3" data-testid="scan-uploader">
      <div className="grid gap-3 sm:grid-cols-2">
        <label className="block text-sm">
          <span className="font-medium text-stone-800">{t("upload.kind")}</span>
          <select value={kind} onChange={(e) => setKind(e.target.value as ScanKindValue)} className="mt-1 block w-full rounded-md border border-stone-300 bg-white px-2.5 py-1.5 text-sm" name="kind">
            {scanKinds.map((k) => (
              <option key={k} value={k}>
                {t(`kinds.${k}`)}
              </option>
            ))}
          </select>
        </label>
        <label className="block text-sm">
          <span className="font-medium text-stone-800">{t("upload.dpi")}</span>
          <input
            type="number"
            inputMode="decimal"
            min={DPI_MIN}
            max={DPI_MAX}
            value={dpi}
            onChange={(e) => setDpi(e.target.value)}
            aria-invalid={dpiInvalid || undefined}
            aria-describedby={dpiInvalid ? "scan-dpi-hint scan-dpi-error" : "scan-dpi-hint"}
            className={cn("mt-1 block w-full rounded-md border px-2.5 py-1.5 text-sm", dpiInvalid ? "border-red-400" : "border-stone-300")}
            name="dpi"
          />
          <span id="scan-dpi-hint" className="mt-1 block text-xs text-stone-500">
            {t("upload.dpiHint")}
          </span>
          <span id="scan-dpi-error" className={cn("mt-1 block text-sm text-red-700", !dpiInvalid && "sr-only")} aria-live="polite">
            {dpiInvalid ? t("upload.dpiInvalid") : null}
          </span>
        </label>
      </div>

      <div
        onDragOver={(e) => {
          e.preventDefault();
          setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={(e) => {
          e.preventDefault();
          setDragging(false);
          if (!dpiInvalid) add(e.dataTransfer.files);
        }}
        className={cn("rounded-lg border-2 border-dashed px-4 py-6 text-center text-sm", dragging ? "border-ink-500 bg-ink-50" : "border-stone-300 bg-stone-50")}
        data-testid="scan-drop"
      >
        <p className="text-stone-700">
          {t("upload.drop")}{" "}
          <label className="cursor-pointer font-medium text-ink-700 underline">
            {t("upload.pick")}
            <input
              type="file"
              multiple
              accept="image/png,image/jpeg,image/tiff,image/webp,.png,.jpg,.jpeg,.tif,.tiff,.webp"
              className="sr-only"
              disabled={dpiInvalid || !hydrated}
              onChange={(e) => {
                add(e.target.files);
                e.target.value = "";
              }}
              data-testid="scan-file-input"
            />
          </label>
        </p>
        <p className="mt-1 text-xs text-stone-500">{t("upload.accepted", { maxMb: Math.round((maxBytes / (1024 * 1024)) * 10) / 10 })}</p>
      </div>

      {items.length > 0 ? (
        <div>
          <div className="flex items-center justify-between">
            <h3 className="text-sm font-medium text-stone-800">{t("upload.queue")}</h3>
            <Button type="button" variant="ghost" className="px-2 py-1 text-xs" onClick={() => setItems((list) => list.filter((i) => i.status !== "done" && i.status !== "failed"))}>
              {t("upload.clear")}
            </Button>
          </div>
          <ul className="mt-2 space-y-2" data-testid="upload-queue">
            {items.map((item) => (
              <li key={item.id} className="rounded-md border border-stone-200 px-3 py-2 text-sm" data-status={item.status}>
                <div className="flex items-center justify-between gap-3">
                  <span className="truncate font-medium text-stone-800">{item.file.name}</span>
                  <span className={cn("shrink-0 text-xs", item.status === "failed" ? "text-red-700" : item.status === "done" ? "text-emerald-700" : "text-stone-500")}>
                    {item.status === "uploading" ? t("upload.status.uploading", { percent: item.progress }) : t(`upload.status.${item.status}`)}
                  </span>
                </div>
                <div
                  role="progressbar"
                  aria-label={t("upload.progressLabel", { name: item.file.name })}
                  aria-valuemin={0}
                  aria-valuemax={100}
                  aria-valuenow={Math.round(item.progress * 100)}
                  className="mt-1.5 h-1.5 overflow-hidden rounded-full bg-stone-200"
                >
                  <div
                    className={cn("h-full transition-[width]", item.status === "failed" ? "bg-red-500" : item.status === "done" ? "bg-emerald-600" : "bg-ink-600", item.status === "processing" && "animate-pulse")}
                    style={{ width: `${Math.round(item.progress * 100)}%` }}
                  />
                </div>
                {item.error ? (
                  <p role="alert" className="mt-1.5 text-xs text-red-800">
                    {item.error}
                  </p>
                ) : null}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
