"use client";

import { useFormatter, useTranslations } from "next-intl";
import { useMemo, useRef, useState } from "react";
import { measures } from "@/lib/i18n/measures";
import { Button } from "@/components/ui/button";
import type { StampPicture } from "@/lib/contracts/plans";
import type { LayerName, Leftover, LayoutPicture, LayoutSpec } from "@/lib/layout";
import type { UnitSystem } from "@/lib/stamps/format";
import { livePicture } from "./live-layout";
import { PlanPicture, type PictureLabels } from "./plan-picture";

const MIN_WINDOW_MM = 250;
const MAX_WINDOW_MM = 6000;
const DEFAULT_WINDOW_MM = 1200;

/** The labels a picture needs, in the person's language and units. */
export function usePictureLabels(unitSystem: UnitSystem, title: string): PictureLabels {
  const t = useTranslations("plans.picture");
  const format = useFormatter();
  return {
    title,
    leftSelvedge: t("leftSelvedge"),
    rightSelvedge: t("rightSelvedge"),
    margin: (text) => t("margin", { length: text }),
    leftover: (text) => t("leftover", { length: text }),
    border: t("border"),
    length: (mm) => measures(format, unitSystem).length(mm),
    format: (v, o) => format.number(v, o),
  };
}

/**
 * The live picture with zoom, pan and a position down the run; only the window in view is laid out and drawn, so a
 * 100 m plan costs what its visible metre costs. With both faces waxed, the back face's twin stands beside the front.
 */
export function PictureViewport({ spec, leftover, stampPictures, unitSystem }: { spec: LayoutSpec; leftover: Leftover; stampPictures: Partial<Record<LayerName, StampPicture | null>>; unitSystem: UnitSystem }) {
  const t = useTranslations("plans.picture");
  const format = useFormatter();
  const pieceLength = spec.cloth.lengthMm ?? spec.cloth.pieceLengthMm ?? 1000;
  const [view, setView] = useState({ startMm: 0, lengthMm: DEFAULT_WINDOW_MM });
  const lengthMm = Math.min(view.lengthMm, pieceLength);
  const startMm = Math.max(0, Math.min(view.startMm, pieceLength - lengthMm));
  const picture: LayoutPicture | null = useMemo(() => livePicture(spec, { startMm, lengthMm }), [spec, startMm, lengthMm]);
  const drag = useRef<{ y: number; start: number; scale: number } | null>(null);
  const frontLabels = usePictureLabels(unitSystem, t("frontTitle"));
  const backLabels = usePictureLabels(unitSystem, t("backTitle"));
  const both = spec.sides === 2;

  const zoom = (factor: number) => setView({ startMm, lengthMm: Math.max(MIN_WINDOW_MM, Math.min(MAX_WINDOW_MM, lengthMm * factor)) });
  const moveTo = (mm: number) => setView({ lengthMm, startMm: Math.max(0, Math.min(pieceLength - lengthMm, mm)) });

  if (!picture) return <p className="text-sm text-stone-600">{t("cannotDraw")}</p>;
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-2 text-sm" role="group" aria-label={t("controls")}>
        <Button type="button" variant="secondary" className="px-2.5 py-1" onClick={() => zoom(1 / 1.5)} disabled={lengthMm <= MIN_WINDOW_MM}>
          {t("zoomIn")}
        </Button>
        <Button type="button" variant="secondary" className="px-2.5 py-1" onClick={() => zoom(1.5)} disabled={lengthMm >= Math.min(MAX_WINDOW_MM, pieceLength)}>
          {t("zoomOut")}
        </Button>
        <Button type="button" variant="secondary" className="px-2.5 py-1" onClick={() => moveTo(startMm - lengthMm * 0.8)} disabled={startMm <= 0}>
          {t("up")}
        </Button>
        <Button type="button" variant="secondary" className="px-2.5 py-1" onClick={() => moveTo(startMm + lengthMm * 0.8)} disabled={startMm + lengthMm >= pieceLength}>
          {t("down")}
        </Button>
        <label className="flex min-w-48 flex-1 items-center gap-2 text-stone-700">
          <span className="whitespace-nowrap">{t("position")}</span>
          <input
            type="range"
            min={0}
            max={Math.max(0, Math.round(pieceLength - lengthMm))}
            step={Math.max(1, Math.round(lengthMm / 20))}
            value={Math.round(startMm)}
            onChange={(e) => moveTo(Number(e.target.value))}
            className="w-full"
            aria-valuetext={t("showing", { from: measures(format, unitSystem).length(startMm), to: measures(format, unitSystem).length(startMm + lengthMm) })}
          />
        </label>
      </div>
      <p className="text-xs text-stone-600" data-testid="picture-window">
        {t("showing", { from: measures(format, unitSystem).length(startMm), to: measures(format, unitSystem).length(startMm + lengthMm) })} · {t("impressionsDrawn", { count: picture.impressions.length })}
      </p>
      <div
        className={both ? "grid cursor-grab touch-none select-none gap-3 active:cursor-grabbing sm:grid-cols-2" : "cursor-grab touch-none select-none active:cursor-grabbing"}
        data-testid="plan-picture"
        onPointerDown={(e) => {
          const box = e.currentTarget.getBoundingClientRect();
          drag.current = { y: e.clientY, start: startMm, scale: lengthMm / Math.max(1, box.height) };
          e.currentTarget.setPointerCapture(e.pointerId);
        }}
        onPointerMove={(e) => {
          if (!drag.current) return;
          moveTo(drag.current.start - (e.clientY - drag.current.y) * drag.current.scale);
        }}
        onPointerUp={() => (drag.current = null)}
        onPointerCancel={() => (drag.current = null)}
      >
        <figure className="space-y-1">
          {both ? <figcaption className="text-xs font-medium text-stone-700">{t("frontTitle")}</figcaption> : null}
          <PlanPicture picture={picture} face="front" stampPictures={stampPictures} leftover={leftover} unitSystem={unitSystem} labels={frontLabels} idPrefix="live" className="h-auto max-h-[70vh] w-full rounded border border-stone-200 bg-white" />
        </figure>
        {both ? (
          <figure className="space-y-1">
            <figcaption className="text-xs font-medium text-stone-700">{t("backTitle")}</figcaption>
            <PlanPicture picture={picture} face="back" stampPictures={stampPictures} leftover={leftover} unitSystem={unitSystem} labels={backLabels} idPrefix="live" className="h-auto max-h-[70vh] w-full rounded border border-stone-200 bg-white" />
          </figure>
        ) : null}
      </div>
    </div>
  );
}
