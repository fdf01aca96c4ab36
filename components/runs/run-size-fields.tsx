"use client";

import { useTranslations } from "next-intl";
import { useState } from "react";
import { Field } from "@/components/ui/field";
import type { FieldErrors } from "@/lib/errors";

/**
 * A run's size, as metres or as pieces of a length (cm), with the choice between them; `sizeBy` goes with the
 * form so the action sends only the chosen size. `values` are what the boxes show (typed back after a refusal).
 */
export function RunSizeFields({
  idPrefix,
  errors,
  values,
  initialSizeBy,
  stateKey,
}: {
  idPrefix: string;
  errors: FieldErrors;
  values: { metres: string; pieces: string; pieceLengthCm: string };
  initialSizeBy: "metres" | "pieces";
  stateKey: string;
}) {
  const t = useTranslations();
  const [sizeBy, setSizeBy] = useState(initialSizeBy);
  return (
    <fieldset className="space-y-3">
      <legend className="text-sm font-medium text-stone-800">{t("runs.form.sizeBy")}</legend>
      <div className="flex gap-4 text-sm">
        <label className="flex items-center gap-1.5">
          <input type="radio" name="sizeBy" value="metres" checked={sizeBy === "metres"} onChange={() => setSizeBy("metres")} /> {t("runs.form.byMetres")}
        </label>
        <label className="flex items-center gap-1.5">
          <input type="radio" name="sizeBy" value="pieces" checked={sizeBy === "pieces"} onChange={() => setSizeBy("pieces")} /> {t("runs.form.byPieces")}
        </label>
      </div>
      {sizeBy === "metres" ? (
        <Field id={`${idPrefix}-metres`} label={t("runs.form.metres")} errors={errors.metres}>
          {(aria) => <input {...aria} name="metres" inputMode="decimal" defaultValue={values.metres} key={`metres-${stateKey}`} />}
        </Field>
      ) : (
        <div className="grid gap-3 sm:grid-cols-2">
          <Field id={`${idPrefix}-pieces`} label={t("runs.form.pieces")} hint={t("runs.form.piecesHint")} errors={errors.pieces ?? errors.metres}>
            {(aria) => <input {...aria} name="pieces" inputMode="numeric" defaultValue={values.pieces} key={`pieces-${stateKey}`} />}
          </Field>
          <Field id={`${idPrefix}-piece-length`} label={t("runs.form.pieceLength")} errors={errors.pieceLengthMm}>
            {(aria) => <input {...aria} name="pieceLengthCm" inputMode="decimal" defaultValue={values.pieceLengthCm} key={`length-${stateKey}`} />}
          </Field>
        </div>
      )}
    </fieldset>
  );
}
