import type { Locale } from "./config";
import enApi from "./messages/en/api.json";
import enAuth from "./messages/en/auth.json";
import enEmails from "./messages/en/emails.json";
import enErrors from "./messages/en/errors.json";
import enLayout from "./messages/en/layout.json";
import enPeople from "./messages/en/people.json";
import enPlans from "./messages/en/plans.json";
import enRequests from "./messages/en/requests.json";
import enScans from "./messages/en/scans.json";
import enShell from "./messages/en/shell.json";
import enStamps from "./messages/en/stamps.json";
import enWax from "./messages/en/wax.json";
import enWaxRoom from "./messages/en/wax-room.json";
import enMotifs from "./messages/en/motifs.json";
import enRuns from "./messages/en/runs.json";
import enOverview from "./messages/en/overview.json";
import idApi from "./messages/id/api.json";
import idAuth from "./messages/id/auth.json";
import idEmails from "./messages/id/emails.json";
import idErrors from "./messages/id/errors.json";
import idLayout from "./messages/id/layout.json";
import idPeople from "./messages/id/people.json";
import idPlans from "./messages/id/plans.json";
import idRequests from "./messages/id/requests.json";
import idScans from "./messages/id/scans.json";
import idShell from "./messages/id/shell.json";
import idStamps from "./messages/id/stamps.json";
import idWax from "./messages/id/wax.json";
import idWaxRoom from "./messages/id/wax-room.json";
import idMotifs from "./messages/id/motifs.json";
import idRuns from "./messages/id/runs.json";
import idOverview from "./messages/id/overview.json";

/** Languages that have a catalogue: every language people can choose (`locales` in config.ts). */
export type CatalogueLocale = Locale;

// One file per area, each holding whole top-level namespaces, so areas can grow without
// touching each other's files. Both lists name the same files in the same order;
// tests/unit/catalogue.test.ts checks no namespace is defined twice, and
// tests/unit/catalogue-parity.test.ts that the two languages have the same keys and placeholders.
export const catalogueFiles = {
  en: [enShell, enAuth, enPeople, enErrors, enEmails, enLayout, enStamps, enScans, enApi, enWax, enWaxRoom, enPlans, enRequests, enMotifs, enRuns, enOverview],
  id: [idShell, idAuth, idPeople, idErrors, idEmails, idLayout, idStamps, idScans, idApi, idWax, idWaxRoom, idPlans, idRequests, idMotifs, idRuns, idOverview],
} satisfies Record<CatalogueLocale, object[]>;

const merge = (files: object[]) => Object.assign({}, ...files) as Record<string, unknown>;
const catalogues: Record<CatalogueLocale, Record<string, unknown>> = {
  en: merge(catalogueFiles.en),
  id: merge(catalogueFiles.id),
};

export function messagesFor(locale: CatalogueLocale): Record<string, unknown> {
  return catalogues[locale];
}
