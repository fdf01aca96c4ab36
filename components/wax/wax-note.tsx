"use client";

import { useTranslations } from "next-intl";
import type { WaxNote } from "@/lib/contracts/wax";

/** The text of a caution or refusal (code = catalogue key, params its values), in the reader's language. */
export function useNoteText() {
  const t = useTranslations();
  return (note: WaxNote) => {
    const key = note.code as Parameters<typeof t>[0];
    const values = Object.fromEntries(Object.entries(note.params).map(([k, v]) => [k, typeof v === "boolean" ? String(v) : v]));
    return t.has(key) ? t(key, values) : t("validation.invalid");
  };
}

export function NoteText({ note }: { note: WaxNote }) {
  const text = useNoteText();
  return <>{text(note)}</>;
}
