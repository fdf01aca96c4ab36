import type { StampPicture } from "@/lib/contracts/plans";
import type { Impression, LayerName, Leftover, LayoutPicture, PictureLayer } from "@/lib/layout";
import type { UnitSystem } from "@/lib/stamps/format";
import { rulerTicks } from "./ruler";

// The cloth band to scale (mm in the SVG's own units): selvedges, margins, border strips, each impression drawn from
// its stamp's own image — the wax-print scan, else its outline, else its footprint shaded by its coverage — mirrored
// or turned by its matrix, and cut to its layer's band; rulers in the person's units and labelled dimensions.
// No hooks: the planner, the compare page and the stamping sheet all draw with it. SVG attributes and classes only
// (the Content-Security-Policy allows no inline styles).

export interface PictureLabels {
  title: string;
  leftSelvedge: string;
  rightSelvedge: string;
  margin: (text: string) => string;
  leftover: (text: string) => string;
  border: string;
  /** A length in the person's units, e.g. "20 mm" or "0.79 in". */
  length: (mm: number) => string;
  format: (value: number, options?: { maximumFractionDigits?: number }) => string;
}

export interface PlanPictureProps {
  picture: LayoutPicture;
  face: "front" | "back";
  /** Each layer's stamp picture (null or absent: drawn from its outline or footprint). */
  stampPictures: Partial<Record<LayerName, StampPicture | null>>;
  leftover?: Leftover;
  unitSystem: UnitSystem;
  labels: PictureLabels;
  /** Prefix of the SVG element ids, unique on the page. */
  idPrefix: string;
  /** Number the impressions in stamping order (the stamping sheet). */
  numbered?: boolean;
  /** The SVG's width attribute, e.g. "115mm" for a printed scale; default fills its box. */
  width?: string;
  height?: string;
  className?: string;
}

const n = (v: number) => {
  const s = Number(v.toFixed(3)).toString();
  return s === "-0" ? "0" : s;
};

/** A layer's strip as seen on this face: the back is the front mirrored through the cloth. */
function strip(layer: PictureLayer, face: "front" | "back", width: number) {
  return face === "front" ? { x0: layer.x0Mm, x1: layer.x1Mm } : { x0: width - layer.x1Mm, x1: width - layer.x0Mm };
}

function StampDef({ id, layer, picture }: { id: string; layer: PictureLayer; picture: StampPicture | null | undefined }) {
  const w = layer.stampWidthMm;
  const h = layer.stampHeightMm;
  if (picture) {
    return (
      <g id={id} clipPath={`url(#${id}-fp)`}>
        <clipPath id={`${id}-fp`}>
          <rect width={n(w)} height={n(h)} />
        </clipPath>
        <rect width={n(w)} height={n(h)} className="fill-white" />
        <image href={picture.href} x={n((w - picture.widthMm) / 2)} y={n((h - picture.heightMm) / 2)} width={n(picture.widthMm)} height={n(picture.heightMm)} preserveAspectRatio="none" className="mix-blend-multiply" />
      </g>
    );
  }
  if (layer.source === "outline") return <path id={id} d={layer.pathData} fillRule={layer.fillRule} className="fill-soga-700" />;
  return <rect id={id} width={n(w)} height={n(h)} className="fill-soga-700" fillOpacity={n(layer.areaFactor)} />;
}

/** The SVG's own box (mm): the cloth window and the room for rulers and labels around it; for a printed scale. */
export function pictureBox(picture: LayoutPicture): { widthMm: number; heightMm: number } {
  const u = Math.max(picture.clothWidthMm, 200) / 100;
  return { widthMm: picture.clothWidthMm + 18 * u, heightMm: picture.window.endMm - picture.window.startMm + 14 * u };
}

export function PlanPicture({ picture, face, stampPictures, leftover, unitSystem, labels, idPrefix, numbered, width, height, className }: PlanPictureProps) {
  const W = picture.clothWidthMm;
  const { startMm, endMm } = picture.window;
  const L = endMm - startMm;
  const u = Math.max(W, 200) / 100;
  const font = 2.4 * u;
  const top = 13 * u;
  const side = 9 * u;
  const mirrorX = (x: number) => (face === "front" ? x : W - x);
  const band = face === "front" ? picture.bandMm : { x0: W - picture.bandMm.x1, x1: W - picture.bandMm.x0 };
  const impressions = picture.impressions.filter((i) => i.face === face);
  const defId = (layer: LayerName) => `${idPrefix}-${face}-stamp-${layer}`;
  const clipId = (layer: LayerName) => `${idPrefix}-${face}-band-${layer}`;
  const across = rulerTicks(0, W, unitSystem, labels.format, 8);
  const down = rulerTicks(startMm, endMm, unitSystem, labels.format, 8);
  const lo = face === "front" ? leftover : leftover && { leftMm: leftover.rightMm, rightMm: leftover.leftMm };
  const margins = [
    { x0: 0, x1: band.x0 },
    { x0: band.x1, x1: W },
  ].filter((m) => m.x1 - m.x0 > 0.05);
  const leftovers = lo
    ? [
        { x0: band.x0, x1: band.x0 + lo.leftMm },
        { x0: band.x1 - lo.rightMm, x1: band.x1 },
      ].filter((m) => m.x1 - m.x0 > 0.05)
    : [];
  const order = new Map<Impression, number>();
  if (numbered) impressions.forEach((imp, k) => order.set(imp, k + 1));
  const dimension = (x0: number, x1: number, y: number, text: string, key: string) => (
    <g key={key} className="fill-stone-700 stroke-stone-500">
      <line x1={n(x0)} x2={n(x1)} y1={n(y)} y2={n(y)} strokeWidth={n(u * 0.15)} />
      <line x1={n(x0)} x2={n(x0)} y1={n(y - u)} y2={n(y + u)} strokeWidth={n(u * 0.15)} />
      <line x1={n(x1)} x2={n(x1)} y1={n(y - u)} y2={n(y + u)} strokeWidth={n(u * 0.15)} />
      <text x={n((x0 + x1) / 2)} y={n(y - 1.2 * u)} fontSize={n(font * 0.85)} textAnchor="middle" stroke="none">
        {text}
      </text>
    </g>
  );

  return (
    <svg
      xmlns="http://www.w3.org/2000/svg"
      viewBox={`${n(-side)} ${n(startMm - top)} ${n(W + 2 * side)} ${n(L + top + u)}`}
      width={width}
      height={height}
      role="img"
      aria-label={labels.title}
      className={className}
      data-face={face}
      data-window={`${n(startMm)}-${n(endMm)}`}
    >
      <title>{labels.title}</title>
      <defs>
        {picture.layers.map((layer) => (
          <g key={layer.layer}>
            <StampDef id={defId(layer.layer)} layer={layer} picture={stampPictures[layer.layer]} />
            <clipPath id={clipId(layer.layer)}>
              <rect x={n(strip(layer, face, W).x0)} y={n(startMm)} width={n(layer.x1Mm - layer.x0Mm)} height={n(L)} />
            </clipPath>
          </g>
        ))}
      </defs>
      <rect x="0" y={n(startMm)} width={n(W)} height={n(L)} className="fill-stone-200" />
      <rect x={n(band.x0)} y={n(startMm)} width={n(band.x1 - band.x0)} height={n(L)} className="fill-amber-50" />
      {picture.layers
        .filter((l) => l.layer !== "field")
        .map((l) => {
          const s = strip(l, face, W);
          return <rect key={l.layer} x={n(s.x0)} y={n(startMm)} width={n(s.x1 - s.x0)} height={n(L)} className="fill-soga-100" data-layer={l.layer} />;
        })}
      {picture.layers.map((layer) => (
        <g key={layer.layer} clipPath={`url(#${clipId(layer.layer)})`} data-layer={layer.layer}>
          {impressions
            .filter((i) => i.layer === layer.layer)
            .map((i, k) => (
              <use key={k} href={`#${defId(layer.layer)}`} transform={`matrix(${i.matrix.map(n).join(" ")})`} />
            ))}
        </g>
      ))}
      <g fill="none" className="stroke-stone-500" strokeWidth={n(u * 0.12)}>
        {impressions.map((i, k) => (
          <rect key={k} x={n(i.xMm)} y={n(i.yMm)} width={n(i.widthMm)} height={n(i.heightMm)} strokeDasharray={i.whole ? undefined : `${n(u)} ${n(u * 0.7)}`} data-whole={i.whole ? "true" : "false"} />
        ))}
      </g>
      {numbered ? (
        <g className="fill-ink-800" fontSize={n(font)} textAnchor="middle">
          {impressions.map((i, k) => (
            <text key={k} x={n(i.xMm + i.widthMm / 2)} y={n(i.yMm + i.heightMm / 2 + font / 3)} className="stroke-white" strokeWidth={n(u * 0.3)} paintOrder="stroke">
              {order.get(i)}
            </text>
          ))}
        </g>
      ) : null}
      {/* selvedges */}
      <g className="stroke-stone-700" strokeWidth={n(u * 0.5)}>
        <line x1="0" x2="0" y1={n(startMm)} y2={n(endMm)} />
        <line x1={n(W)} x2={n(W)} y1={n(startMm)} y2={n(endMm)} />
      </g>
      <g className="fill-stone-800" fontSize={n(font)}>
        <text x="0" y={n(startMm - 10.2 * u)}>{labels.leftSelvedge}</text>
        <text x={n(W)} y={n(startMm - 10.2 * u)} textAnchor="end">
          {labels.rightSelvedge}
        </text>
      </g>
      {margins.map((m, k) => dimension(m.x0, m.x1, startMm - 7 * u, labels.margin(labels.length(m.x1 - m.x0)), `margin-${k}`))}
      {leftovers.map((m, k) => dimension(m.x0, m.x1, startMm - 3.6 * u, labels.leftover(labels.length(m.x1 - m.x0)), `leftover-${k}`))}
      {picture.layers
        .filter((l) => l.layer !== "field")
        .map((l) => {
          const s = strip(l, face, W);
          return (
            <text key={l.layer} x={n((s.x0 + s.x1) / 2)} y={n(startMm + 3 * u)} fontSize={n(font * 0.8)} textAnchor="middle" className="fill-soga-700">
              {labels.border}
            </text>
          );
        })}
      {/* rulers: across along the top edge, down the left side */}
      <g className="stroke-stone-600" strokeWidth={n(u * 0.12)}>
        {across.map((t) => (
          <line key={`a${t.atMm}`} x1={n(mirrorX(t.atMm))} x2={n(mirrorX(t.atMm))} y1={n(startMm)} y2={n(startMm - (t.major ? 1.4 : 0.7) * u)} />
        ))}
        {down.map((t) => (
          <line key={`d${t.atMm}`} x1={n(-(t.major ? 1.4 : 0.7) * u)} x2="0" y1={n(t.atMm)} y2={n(t.atMm)} />
        ))}
      </g>
      <g className="fill-stone-600" fontSize={n(font * 0.6)} textAnchor="middle">
        {across
          .filter((t) => t.label && t.atMm > 0 && t.atMm < W)
          .map((t) => (
            <text key={`al${t.atMm}`} x={n(mirrorX(t.atMm))} y={n(startMm - 1.8 * u)}>
              {t.label}
            </text>
          ))}
      </g>
      <g className="fill-stone-600" fontSize={n(font * 0.7)}>
        {down
          .filter((t) => t.label)
          .map((t) => (
            <text key={`dl${t.atMm}`} x={n(-1.8 * u)} y={n(t.atMm + font * 0.25)} textAnchor="end">
              {t.label}
            </text>
          ))}
      </g>
    </svg>
  );
}
