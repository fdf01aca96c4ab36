"use client";

import { useEffect, useId, useRef } from "react";
import { Button } from "./button";

export interface ConfirmRequest {
  title: string;
  body: string;
  confirmLabel: string;
  tone?: "primary" | "danger";
}

/**
 * A modal question before a change that is hard to take back (native <dialog>: focus stays inside, Escape
 * cancels). Open while `request` is set; answers through onConfirm or onCancel.
 */
export function ConfirmDialog({ request, cancelLabel, onConfirm, onCancel }: { request: ConfirmRequest | null; cancelLabel: string; onConfirm: () => void; onCancel: () => void }) {
  const dialog = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const bodyId = useId();
  useEffect(() => {
    const d = dialog.current;
    if (!d) return;
    if (request && !d.open) d.showModal();
    if (!request && d.open) d.close();
  }, [request]);
  return (
    <dialog
      ref={dialog}
      aria-labelledby={titleId}
      aria-describedby={bodyId}
      onCancel={(e) => {
        e.preventDefault();
        onCancel();
      }}
      className="m-auto w-full max-w-md rounded-lg p-0 shadow-xl backdrop:bg-stone-900/50"
    >
      {request ? (
        <div className="space-y-3 p-5">
          <h2 id={titleId} className="text-base font-semibold text-stone-900">
            {request.title}
          </h2>
          <p id={bodyId} className="text-sm text-stone-700">
            {request.body}
          </p>
          <div className="flex justify-end gap-2 pt-2">
            <Button type="button" variant="secondary" onClick={onCancel} autoFocus>
              {cancelLabel}
            </Button>
            <Button type="button" variant={request.tone === "danger" ? "danger" : "primary"} onClick={onConfirm}>
              {request.confirmLabel}
            </Button>
          </div>
        </div>
      ) : null}
    </dialog>
  );
}
