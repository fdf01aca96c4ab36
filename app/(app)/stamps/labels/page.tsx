import type { Metadata } from "next";
import Link from "next/link";
import { getFormatter, getTranslations } from "next-intl/server";
import QRCode from "qrcode";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/panel";
import { listLocations } from "@/lib/data/stamps/locations";
import { listAllStamps } from "@/lib/data/stamps";
import { env } from "@/lib/env";
import { requirePageActor } from "@/lib/session";
import { shelfUrl, stampUrl } from "@/lib/stamps/codes";
import { queryObject } from "@/lib/validation/common";
import { stampCodeSchema, stampListQuerySchema } from "@/lib/validation/stamps";
import { parseInput } from "@/lib/validation/parse";
import { PrintButton } from "./print-button";
import { locationLabel } from "@/lib/stamps/format";
import { measures } from "@/lib/i18n/measures";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("labels"))("title") };
}

const MAX_LABELS = 300;
const qr = (text: string) => QRCode.toString(text, { type: "svg", margin: 0, errorCorrectionLevel: "M" });

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

/** Printable labels: stamp labels (for the filters of the table, or ?codes=) or shelf labels (?kind=shelf). */
export default async function LabelsPage({ searchParams }: Props) {
  const actor = await requirePageActor();
  const raw = await searchParams;
  const params = new URLSearchParams(Object.entries(raw).flatMap(([k, v]) => (Array.isArray(v) ? v.map((x) => [k, x]) : v ? [[k, v]] : [])));
  const [t, format] = await Promise.all([getTranslations(), getFormatter()]);
  const appUrl = env().APP_URL;

  if (params.get("kind") === "shelf") {
    const site = params.get("site");
    const locations = (await listLocations(actor)).filter((l) => !site || l.site === site);
    const labels = await Promise.all(locations.map(async (l) => ({ ...l, svg: await qr(shelfUrl(appUrl, l.id)) })));
    return (
      <div className="print-shelf-labels" data-testid="label-sheet">
        <LabelsHeader title={t("labels.shelfTitle")} intro={t("labels.shelfIntro", { count: labels.length })} />
        {labels.length === 0 ? <Notice>{t("labels.noneShelf")}</Notice> : null}
        <div className="grid grid-cols-2 gap-[4mm] print:gap-[3mm]" data-testid="labels">
          {labels.map((l) => (
            <article key={l.id} className="flex h-[55mm] break-inside-avoid items-center gap-[5mm] rounded border border-stone-300 bg-white p-[5mm]">
              <div className="h-[40mm] w-[40mm] shrink-0 [&>svg]:h-full [&>svg]:w-full" dangerouslySetInnerHTML={{ __html: l.svg }} />
              <div className="min-w-0">
                <p className="text-sm text-stone-600">{l.site}</p>
                <p className="font-mono text-4xl font-bold tracking-tight text-stone-900">{l.code}</p>
                {l.description ? <p className="mt-1 text-sm text-stone-700">{l.description}</p> : null}
              </div>
            </article>
          ))}
        </div>
      </div>
    );
  }

  // ?codes= (the form below, or a stamp's "Print label") names the stamps; without it the table's filters do.
  const codesText = params.get("codes");
  const asked = (codesText ?? "").split(/[\s,;]+/).filter(Boolean);
  const checked = asked.map((c) => ({ typed: c, parsed: stampCodeSchema.safeParse(c) }));
  const codes = checked.flatMap((c) => (c.parsed.success ? [c.parsed.data] : []));
  const badCodes = checked.filter((c) => !c.parsed.success).map((c) => c.typed);
  const parsed = parseInput(stampListQuerySchema, queryObject(params));
  const query = parsed.success ? parsed.data : {};
  let stamps = await listAllStamps(actor, codesText !== null ? { codes } : query, MAX_LABELS + 1);
  const tooMany = stamps.length > MAX_LABELS;
  stamps = stamps.slice(0, MAX_LABELS);
  const unknownCodes = codes.filter((c) => !stamps.some((s) => s.code === c));
  const codeErrors = [
    ...(codesText !== null && asked.length === 0 ? [t("labels.codesEmpty")] : []),
    ...(badCodes.length ? [t("labels.codesInvalid", { codes: badCodes.join(", ") })] : []),
    ...(unknownCodes.length && !tooMany ? [t("labels.codesUnknown", { codes: unknownCodes.join(", ") })] : []),
  ];
  const labels = await Promise.all(stamps.map(async (s) => ({ ...s, svg: await qr(stampUrl(appUrl, s.code)) })));
  // A4 with 8 mm margins when printed: the named page stamp-labels in app/globals.css.
  return (
    <div className="print-stamp-labels" data-testid="label-sheet">
      <LabelsHeader title={t("labels.title")} intro={t("labels.intro", { count: labels.length })} />
      <form method="get" className="mb-4 flex flex-wrap items-start gap-3 print:hidden" aria-label={t("labels.codesForm")} noValidate>
        <div className="min-w-72 flex-1">
          <Field id="label-codes" label={t("labels.codes")} hint={t("labels.codesHint")} errors={codeErrors.length ? codeErrors : undefined}>
            {(aria) => <input {...aria} name="codes" autoComplete="off" defaultValue={codesText ?? ""} className={`${aria.className} font-mono uppercase`} />}
          </Field>
        </div>
        <Button type="submit" variant="secondary" className="mt-6">
          {t("labels.codesSubmit")}
        </Button>
      </form>
      {tooMany ? <Notice tone="warning" className="mb-4 print:hidden">{t("labels.tooMany", { max: MAX_LABELS })}</Notice> : null}
      {labels.length === 0 ? <Notice>{t("labels.none")}</Notice> : null}
      <div className="grid grid-cols-3 gap-[3mm] print:gap-[2mm]" data-testid="labels">
        {labels.map((s) => (
          <article key={s.id} data-code={s.code} className="flex h-[38mm] break-inside-avoid items-center gap-[3mm] overflow-hidden rounded border border-stone-300 bg-white p-[3mm]">
            <div className="h-[30mm] w-[30mm] shrink-0 [&>svg]:h-full [&>svg]:w-full" dangerouslySetInnerHTML={{ __html: s.svg }} />
            <div className="min-w-0 text-[9pt] leading-tight">
              <p className="font-mono text-[13pt] font-bold text-stone-900">{s.code}</p>
              <p className="line-clamp-2 text-stone-800">{s.name}</p>
              <p className="text-stone-600">{measures(format, actor.unitSystem).size(s.widthMm, s.heightMm)}</p>
              <p className="text-stone-600">{locationLabel(s.location) ?? t("stamps.table.noLocation")}</p>
            </div>
          </article>
        ))}
      </div>
    </div>
  );
}

async function LabelsHeader({ title, intro }: { title: string; intro: string }) {
  const t = await getTranslations();
  return (
    <div className="print:hidden">
      <PageHeader
        title={title}
        intro={intro}
        actions={
          <div className="flex items-center gap-3">
            <Link href="/stamps" className="text-sm text-ink-700 hover:underline">
              {t("labels.back")}
            </Link>
            <PrintButton />
          </div>
        }
      />
      <p className="mb-4 text-sm text-stone-600">{t("labels.howTo")}</p>
    </div>
  );
}
