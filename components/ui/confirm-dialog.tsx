"use client";

import { useId } from "react";
import { Button } from "./button";
import { Modal } from "./modal";

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
  const titleId = useId();
  const bodyId = useId();
  return (
    <Modal open={request !== null} onClose={onCancel} labelledBy={titleId} describedBy={bodyId} className="w-full max-w-md">
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
    </Modal>
  );
}
