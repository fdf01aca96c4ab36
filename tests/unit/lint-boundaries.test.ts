import { fileURLToPath } from "node:url";
import { ESLint } from "eslint";
import { beforeAll, describe, expect, it } from "vitest";

// The house rules in eslint.config.mjs, run through ESLint's own API on sample files: each rule must refuse
// its sample violation (as an error, so `npm run lint` fails) and let the allowed import through. The file
// paths are virtual; only the folder decides which rules apply. Relative imports point at real modules, since
// only a resolved relative import has a category; "@/…" imports are also refused by their written source.

const root = fileURLToPath(new URL("../..", import.meta.url));
let eslint: ESLint;

beforeAll(() => {
  eslint = new ESLint({ cwd: root });
});

/** The house rules that fire on `code` placed at `filePath`, e.g. ["house/db-is-storage"]. */
async function houseRules(filePath: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath });
  expect(result.fatalErrorCount, JSON.stringify(result.messages)).toBe(0);
  return result.messages
    .filter((m) => m.ruleId === "boundaries/dependencies")
    .map((m) => {
      expect(m.severity, m.message).toBe(2);
      return m.message.match(/^(house\/[a-z-]+):/)?.[1] ?? m.message;
    });
}

type Case = [filePath: string, code: string];

const rules: { rule: string; refused: Case[]; allowed: Case[] }[] = [
  {
    rule: "house/domain-is-pure",
    refused: [
      ["lib/layout/sample.ts", `import { NextResponse } from "next/server"; export const r = NextResponse;`],
      ["lib/layout/sample.ts", `import { after } from "next"; export const a = after;`],
      ["lib/scans/sample.ts", `import { useState } from "react"; export const s = useState;`],
      ["lib/stamps/sample.ts", `import { createRoot } from "react-dom/client"; export const c = createRoot;`],
      ["lib/wax/sample.ts", `import { db } from "@/db"; export const d = db;`],
      ["lib/units.ts", `import { stamps } from "@/db/schema"; export const t = stamps;`],
      ["lib/stamps/sample.ts", `import type { StampDto } from "@/lib/data/stamps"; export type S = StampDto;`],
      ["lib/stamps/sample.ts", `import { listLocations } from "../data/stamps/locations"; export const l = listLocations;`],
      ["lib/layout/sample.ts", `export async function rows() { return import("../../db/schema"); }`],
    ],
    allowed: [
      ["lib/layout/sample.ts", `import { z } from "zod"; import { MM_PER_INCH } from "@/lib/units"; export const s = z.number().max(MM_PER_INCH);`],
      ["lib/stamps/sample.ts", `import { nextConditions } from "./condition"; export const c = nextConditions;`],
    ],
  },
  {
    rule: "house/domain-owns-input",
    refused: [
      ["lib/layout/sample.ts", `import { layoutRequestSchema } from "@/lib/validation/layout"; export const s = layoutRequestSchema;`],
      ["lib/wax/sample.ts", `import { idParamSchema } from "../validation/common"; export const s = idParamSchema;`],
    ],
    allowed: [["lib/layout/sample.ts", `import { issueKey } from "@/lib/errors"; export const k = issueKey;`]],
  },
  {
    rule: "house/components-no-data",
    refused: [
      ["components/stamps/sample.tsx", `import type { StampEventDto } from "@/lib/data/stamps"; export type E = StampEventDto;`],
      ["components/scans/sample.tsx", `import { listScans } from "@/lib/data/scans"; export const l = listScans;`],
      ["components/ui/sample.tsx", `import { listLocations } from "../../lib/data/stamps/locations"; export const l = listLocations;`],
    ],
    allowed: [["components/stamps/sample.tsx", `import { useStamps } from "@/lib/swr/use-stamps"; export const u = useStamps;`]],
  },
  {
    rule: "house/components-no-app",
    refused: [["components/shell/sample.tsx", `import { signOutAction } from "@/app/(app)/actions"; export const s = signOutAction;`]],
    allowed: [["components/shell/sample.tsx", `import { Button } from "@/components/ui/button"; export const B = Button;`]],
  },
  {
    rule: "house/db-is-storage",
    refused: [
      ["db/sample.ts", `import { AppError } from "@/lib/errors"; export const e = AppError;`],
      ["db/schema/sample.ts", `import { AppError } from "../../lib/errors"; export const e = AppError;`],
      ["db/sample.ts", `import { listStamps } from "@/lib/data/stamps"; export const l = listStamps;`],
    ],
    allowed: [["db/schema/sample.ts", `import { users } from "./users"; export const u = users;`]],
  },
  {
    rule: "house/app-through-data",
    refused: [
      ["app/(app)/stamps/page.tsx", `import { database } from "@/db"; export const d = database;`],
      ["app/api/v1/stamps/route.ts", `import { stamps } from "@/db/schema"; export const s = stamps;`],
      ["app/(app)/layout.tsx", `import { users } from "../../db/schema"; export const u = users;`],
      ["app/(app)/stamps/actions.ts", `import { db } from "@/db"; export const d = db;`],
    ],
    allowed: [["app/(app)/stamps/page.tsx", `import { listStamps } from "@/lib/data/stamps"; export const l = listStamps;`]],
  },
];

describe.each(rules)("$rule", ({ rule, refused, allowed }) => {
  it.each(refused)("refuses %s: %s", async (filePath, code) => {
    expect(await houseRules(filePath, code)).toEqual([rule]);
  }, 30_000);

  it.each(allowed)("allows %s: %s", async (filePath, code) => {
    expect(await houseRules(filePath, code)).toEqual([]);
  }, 30_000);
});
