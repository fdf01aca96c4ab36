"use client";

import Link from "next/link";
import { useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { initialFormState } from "@/lib/actions/form-state";
import type { LocationDto } from "@/lib/contracts/stamps";
import { createLocationAction, locationRowAction } from "../actions";

export function LocationForm({ sites }: { sites: string[] }) {
  const t = useTranslations();
  const [state, action, pending] = useActionState(createLocationAction, initialFormState);
  const failed = state.status === "error";
  const formKey = state.status === "success" ? state.message : "form";
  return (
    <form key={formKey} action={action} aria-label={t("locations.addTitle")} className="grid gap-4 md:grid-cols-[1fr_1fr_2fr_auto] md:items-start" noValidate>
      {state.message ? (
        <Notice tone={state.status === "success" ? "success" : "error"} className="md:col-span-4">
          {state.message}
        </Notice>
      ) : null}
      <Field id="location-site" label={t("locations.site")} hint={t("locations.siteHint")} errors={state.fieldErrors?.site}>
        {(aria) => (
          <>
            <input {...aria} name="site" list="location-sites" autoComplete="off" defaultValue={failed ? state.values?.site : (sites[0] ?? "")} />
            <datalist id="location-sites">
              {sites.map((s) => (
                <option key={s} value={s} />
              ))}
            </datalist>
          </>
        )}
      </Field>
      <Field id="location-code" label={t("locations.code")} hint={t("locations.codeHint")} errors={state.fieldErrors?.code}>
        {(aria) => <input {...aria} name="code" autoComplete="off" defaultValue={failed ? state.values?.code : ""} className={`${aria.className} font-mono uppercase`} />}
      </Field>
      <Field id="location-description" label={t("locations.description")} errors={state.fieldErrors?.description}>
        {(aria) => <input {...aria} name="description" autoComplete="off" defaultValue={failed ? state.values?.description : ""} />}
      </Field>
      <Button type="submit" disabled={pending} className="md:mt-6">
        {t("locations.add")}
      </Button>
    </form>
  );
}

export function LocationRow({ location, canWrite }: { location: LocationDto; canWrite: boolean }) {
  const t = useTranslations();
  const [state, action, pending] = useActionState(locationRowAction, initialFormState);
  const descriptionErrors = state.fieldErrors?.description;
  const descriptionErrorId = `location-${location.id}-description-error`;
  return (
    <li className="flex flex-wrap items-center justify-between gap-3 py-2.5" data-testid={`location-${location.code}`}>
      <div className="min-w-48">
        <Link href={`/stamps?location=${location.id}`} className="font-mono font-medium text-ink-700 hover:underline">
          {location.code}
        </Link>
        <span className="ml-2 text-sm text-stone-600">{t("locations.stampCount", { count: location.stampCount })}</span>
        {location.description && !canWrite ? <p className="text-sm text-stone-600">{location.description}</p> : null}
      </div>
      {canWrite ? (
        <div className="flex flex-1 flex-wrap items-center justify-end gap-2">
          <form action={action} className="flex flex-1 flex-wrap items-center gap-2">
            <input type="hidden" name="id" value={location.id} />
            <input type="hidden" name="intent" value="describe" />
            <input
              name="description"
              aria-label={t("locations.descriptionOf", { code: location.code })}
              aria-invalid={descriptionErrors ? true : undefined}
              aria-describedby={descriptionErrors ? descriptionErrorId : undefined}
              defaultValue={state.status === "error" ? state.values?.description : (location.description ?? "")}
              placeholder={t("locations.descriptionPlaceholder")}
              className="min-w-40 flex-1 rounded-md border border-stone-300 px-2 py-1 text-sm aria-invalid:border-red-500"
            />
            <Button type="submit" variant="secondary" className="px-2.5 py-1 text-xs" disabled={pending}>
              {t("locations.save")}
            </Button>
            <p id={descriptionErrorId} className={descriptionErrors ? "w-full text-sm text-red-700" : "sr-only"} aria-live="polite">
              {descriptionErrors?.join(" ")}
            </p>
          </form>
          <form
            action={action}
            onSubmit={(e) => {
              if (!window.confirm(t("locations.deleteConfirm", { code: location.code }))) e.preventDefault();
            }}
          >
            <input type="hidden" name="id" value={location.id} />
            <input type="hidden" name="intent" value="delete" />
            <Button type="submit" variant="danger" className="px-2.5 py-1 text-xs" disabled={pending || location.stampCount > 0} title={location.stampCount > 0 ? t("locations.notEmpty") : undefined}>
              {t("locations.delete")}
            </Button>
          </form>
        </div>
      ) : null}
      {state.message && !descriptionErrors ? (
        <Notice tone={state.status === "success" ? "success" : "error"} className="w-full">
          {state.message}
        </Notice>
      ) : null}
    </li>
  );
}
