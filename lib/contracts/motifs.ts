// The motif archive's contract with its clients: DTOs, URL builders, the form adapter. Neither server-only nor React.
import { formText } from "./form-input";

export type MotifStampRole = "main" | "filler" | "border" | "corner" | "reverse_twin";
export type ClothFace = "front" | "back" | "both";
/** A stamp at a glance: on the shelf, checked out, in repair (or needing it), retired. */
export type StampAvailability = "onShelf" | "out" | "inRepair" | "retired";

export const motifStampRoleValues: readonly MotifStampRole[] = ["main", "filler", "border", "corner", "reverse_twin"];
export const clothFaceValues: readonly ClothFace[] = ["front", "back", "both"];
export const availabilityValues: readonly StampAvailability[] = ["onShelf", "out", "inRepair", "retired"];

export interface MotifStampDto {
  code: string;
  name: string;
  role: MotifStampRole;
  widthMm: number;
  heightMm: number;
  condition: string;
  availability: StampAvailability;
  /** Thumbnail of its newest scan, if any. */
  thumb: string | null;
}

export interface ColourDto {
  name: string;
  swatch: string;
  dyeNotes: string | null;
  waxStamps: string[];
  face: ClothFace;
  /** Reached by bleaching rather than by a dye (a run's default stages bleach for it). */
  bleach: boolean;
}

export interface ColourwayDto {
  id: string;
  name: string;
  notes: string | null;
  colours: ColourDto[];
}

export interface CollectionRefDto {
  id: string;
  name: string;
}

/** What a card in the archive's grid shows. */
export interface MotifSummaryDto {
  id: string;
  name: string;
  tags: string[];
  designer: string | null;
  collections: CollectionRefDto[];
  mainStamp: MotifStampDto | null;
  stampCount: number;
  colourwayCount: number;
  /** The main stamp is retired or in repair: the motif cannot be stamped as it stands. */
  mainStampProblem: "retired" | "inRepair" | "missing" | null;
  lastUsedOn: string | null;
  updatedAt: string;
}

export interface MotifEventDto {
  kind: "created" | "edited" | "copied";
  actorName: string;
  at: string;
  changes: Array<{ field: string; from: unknown; to: unknown }>;
}

/** A past plan of the motif (plans are their own area; this is what the motif page shows of them). */
export interface MotifPlanDto {
  id: string;
  name: string;
  arrangement: string;
  clothName: string | null;
  clothWidthMm: number;
  updatedAt: string;
  /** The wax estimates saved for the plan, newest first. */
  estimates: { id: string; name: string; gramsPerMetre: number; kgNew: number; planned: boolean; createdAt: string }[];
}

export interface MotifDto extends MotifSummaryDto {
  description: string | null;
  firstUsedOn: string | null;
  notes: string | null;
  copiedFrom: { id: string; name: string } | null;
  stamps: MotifStampDto[];
  colourways: ColourwayDto[];
  version: number;
  createdAt: string;
}

export interface MotifListDto {
  motifs: MotifSummaryDto[];
  total: number;
  page: number;
  pageSize: number;
}

export interface CollectionDto {
  id: string;
  name: string;
  season: string | null;
  year: number | null;
  description: string | null;
  motifCount: number;
  version: number;
}

export const motifUrls = {
  list: (query = "") => `/api/v1/motifs${query ? `?${query}` : ""}`,
  one: (id: string) => `/api/v1/motifs/${encodeURIComponent(id)}`,
  copy: (id: string) => `/api/v1/motifs/${encodeURIComponent(id)}/copy`,
  collections: () => "/api/v1/collections",
  collection: (id: string) => `/api/v1/collections/${encodeURIComponent(id)}`,
  page: (id: string) => `/motifs/${encodeURIComponent(id)}`,
};

/** The planner's address for "start a plan from this motif": main stamp, border, last arrangement, the motif. */
export function startPlanUrl(motif: Pick<MotifDto, "id" | "stamps">, lastArrangement: string | null): string {
  const main = motif.stamps.find((s) => s.role === "main");
  const border = motif.stamps.find((s) => s.role === "border");
  const query = new URLSearchParams();
  if (main) query.set("stamp", main.code);
  if (border) query.set("borderStamp", border.code);
  if (lastArrangement) query.set("arrangement", lastArrangement);
  query.set("motif", motif.id);
  return `/plans/new?${query.toString()}`;
}

/** Availability of a stamp from its condition and whether it is out. */
export function availabilityOf(condition: string, checkedOut: boolean): StampAvailability {
  if (condition === "retired") return "retired";
  if (condition === "in_repair" || condition === "needs_repair") return "inRepair";
  return checkedOut ? "out" : "onShelf";
}

/**
 * The motif form's fields → the create/update input: tags separated by commas, the stamp set one "CODE role"
 * per line, collections ticked, colourways as the JSON the form's colourway editor keeps.
 */
export function motifFormInput(form: FormData): Record<string, unknown> {
  const text = (k: string) => formText(form, k);
  const out: Record<string, unknown> = {
    name: text("name"),
    description: text("description"),
    designer: text("designer"),
    notes: text("notes"),
    tags: text("tags")
      .split(",")
      .map((t) => t.trim())
      .filter(Boolean),
    firstUsedOn: text("firstUsedOn").trim() || null,
    collectionIds: form.getAll("collectionIds").filter((v): v is string => typeof v === "string" && v !== ""),
    stamps: text("stamps")
      .split(/\r?\n/)
      .map((line) => line.trim())
      .filter(Boolean)
      .map((line) => {
        const [code, role] = line.split(/\s+/);
        return { code: code ?? "", role: role ?? "main" };
      }),
  };
  const colourways = text("colourways").trim();
  if (colourways) out.colourways = parseColourways(colourways);
  else if (form.has("colourways")) out.colourways = [];
  if (text("version")) out.version = Number(text("version"));
  return out;
}

const FACES = new Set<string>(clothFaceValues);
/** The word in a colour's brackets that marks it as reached by bleaching (typed as it is, in both languages). */
export const BLEACH_WORD = "bleach";

type ColourInput = { name: string; swatch: string; waxStamps: string[]; face: ClothFace; bleach: boolean; dyeNotes?: string };

/** Dye notes follow " // " on a colour's line (and a colourway's notes on its name line). */
const NOTES = " // ";
const splitNotes = (line: string): [string, string | undefined] => {
  const at = line.indexOf(NOTES.trim());
  return at < 0 ? [line, undefined] : [line.slice(0, at).trim(), line.slice(at + NOTES.trim().length).trim() || undefined];
};

/**
 * One colour as written: "Colour #rrggbb [CODE CODE face bleach] // dye notes" (the word `bleach` marks a colour
 * reached by bleaching); what does not read as one keeps its text as the name and no swatch.
 */
function parseColour(line: string): ColourInput {
  const [c, dyeNotes] = splitNotes(line);
  const m = /^(.*?)\s*(#[0-9a-fA-F]{6})\s*(?:\[([^\]]*)\])?$/.exec(c);
  if (!m) return { name: c, swatch: "", waxStamps: [], face: "front", bleach: false, dyeNotes };
  const words = (m[3] ?? "").split(/[\s,]+/).filter(Boolean);
  const face = (words.find((w) => FACES.has(w.toLowerCase()))?.toLowerCase() ?? "front") as ClothFace;
  const bleach = words.some((w) => w.toLowerCase() === BLEACH_WORD);
  const waxStamps = words.filter((w) => !FACES.has(w.toLowerCase()) && w.toLowerCase() !== BLEACH_WORD);
  return { name: m[1].trim(), swatch: m[2].toLowerCase(), waxStamps, face, bleach, dyeNotes };
}

/**
 * Colourways as text lines, one colour a line in the order of work under its colourway's name:
 *
 *     Brown and indigo:
 *     Undyed mori #f4efe6 [CODE both]
 *     Soga brown #8a5a2b
 *
 * A line with a colon starts a colourway; colours written after the colon on the same line, separated by ";",
 * belong to it too (the older one-line form, "Name: Colour #rrggbb [CODE face]; Colour #rrggbb"). A colour line
 * before any name starts a colourway without one, so the schema names what is missing. What does not read as a
 * colour keeps its text as the name and an empty swatch, so the schema names the line's problem. Notes follow " // ":
 * a colour's dye notes on its line ("Soga brown #8a5a2b // two baths, fix with lime"), a colourway's on its name line.
 */
export function parseColourways(text: string): Array<{ name: string; notes?: string; colours: ColourInput[] }> {
  const ways: Array<{ name: string; notes?: string; colours: ColourInput[] }> = [];
  for (const raw of text.split(/\r?\n/)) {
    const line = raw.trim().replace(/^[-•*]\s+/, "");
    if (!line) continue;
    const colon = line.indexOf(":");
    if (colon >= 0) {
      const after = line.slice(colon + 1).trim();
      // "Name: // notes" carries the colourway's notes; otherwise colours may follow on the line (the older form).
      const hasNotes = after.startsWith(NOTES.trim());
      const notes = hasNotes ? after.slice(NOTES.trim().length).trim() || undefined : undefined;
      const rest = hasNotes ? "" : after;
      ways.push({
        name: line.slice(0, colon).trim(),
        notes,
        colours: rest
          .split(";")
          .map((c) => c.trim())
          .filter(Boolean)
          .map(parseColour),
      });
      continue;
    }
    if (!ways.length) ways.push({ name: "", colours: [] });
    ways[ways.length - 1].colours.push(parseColour(line));
  }
  return ways;
}

/** Colourways back as the form's lines, one colour a line under its colourway (parseColourways reads them again unchanged). */
export function colourwaysText(colourways: ColourwayDto[]): string {
  return colourways
    .map((w) =>
      [
        `${w.name}:${w.notes ? `${NOTES}${w.notes}` : ""}`,
        ...w.colours.map(
          (c) =>
            `${c.name} ${c.swatch}${c.waxStamps.length || c.face !== "front" || c.bleach ? ` [${[...c.waxStamps, c.face, ...(c.bleach ? [BLEACH_WORD] : [])].join(" ")}]` : ""}${c.dyeNotes ? `${NOTES}${c.dyeNotes}` : ""}`,
        ),
      ].join("\n"),
    )
    .join("\n\n");
}

/** The stamp set as the form's lines: "CODE role". */
export const stampsText = (stamps: Pick<MotifStampDto, "code" | "role">[]) => stamps.map((s) => `${s.code} ${s.role}`).join("\n");
