import type { Locale } from "./config";
import enApi from "./messages/en/api.json";
import enAuth from "./messages/en/auth.json";
import enEmails from "./messages/en/emails.json";
import enErrors from "./messages/en/errors.json";
import enLayout from "./messages/en/layout.json";
import enPeople from "./messages/en/people.json";
import enScans from "./messages/en/scans.json";
import enShell from "./messages/en/shell.json";
import enStamps from "./messages/en/stamps.json";
import enWax from "./messages/en/wax.json";

// One file per area, each holding whole top-level namespaces, so areas can grow without
// touching each other's files. tests/unit/catalogue.test.ts checks no namespace is defined twice.
export const catalogueFiles = {
  en: [enShell, enAuth, enPeople, enErrors, enEmails, enLayout, enStamps, enScans, enApi, enWax],
} satisfies Record<Locale, object[]>;

const merge = (files: object[]) => Object.assign({}, ...files) as Record<string, unknown>;
const catalogues: Record<Locale, Record<string, unknown>> = { en: merge(catalogueFiles.en) };

export function messagesFor(locale: Locale): Record<string, unknown> {
  return catalogues[locale];
}
