import { measures } from "@/lib/i18n/measures";
import type { UnitSystem } from "@/lib/stamps/format";
import type { PictureLabels } from "./plan-picture";

type Translate = (key: "plans.picture.leftSelvedge" | "plans.picture.rightSelvedge" | "plans.picture.margin" | "plans.picture.leftover" | "plans.picture.border" | "plans.picture.frontTitle", values?: Record<string, string>) => string;
type Format = { number: (value: number, options?: { maximumFractionDigits?: number }) => string };

/** The picture's labels from a page's translator and formatter (server pages: the compare page and the sheet). */
export function pictureLabels(t: Translate, format: Format, unitSystem: UnitSystem): PictureLabels {
  return {
    title: t("plans.picture.frontTitle"),
    leftSelvedge: t("plans.picture.leftSelvedge"),
    rightSelvedge: t("plans.picture.rightSelvedge"),
    margin: (text) => t("plans.picture.margin", { length: text }),
    leftover: (text) => t("plans.picture.leftover", { length: text }),
    border: t("plans.picture.border"),
    length: (mm) => measures(format, unitSystem).length(mm),
    format: (v, o) => format.number(v, o),
  };
}
