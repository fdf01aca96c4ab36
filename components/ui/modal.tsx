"use client";

import { useEffect, useRef } from "react";
import { cn } from "./cn";

interface Props {
  /** Shown while true (native <dialog> as a modal: focus stays inside, the page behind is inert). */
  open: boolean;
  /** Escape, or a close button inside: the caller decides what closing means. */
  onClose: () => void;
  labelledBy?: string;
  describedBy?: string;
  className?: string;
  "data-testid"?: string;
  children: React.ReactNode;
}

/** The one modal of the app; ConfirmDialog and the scan viewer are built on it. */
export function Modal({ open, onClose, labelledBy, describedBy, className, children, ...rest }: Props) {
  const dialog = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const d = dialog.current;
    if (!d) return;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
  }, [open]);
  return (
    <dialog
      ref={dialog}
      aria-labelledby={labelledBy}
      aria-describedby={describedBy}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      className={cn("m-auto rounded-lg p-0 shadow-xl backdrop:bg-stone-900/60", className)}
      data-testid={rest["data-testid"]}
    >
      {open ? children : null}
    </dialog>
  );
}
