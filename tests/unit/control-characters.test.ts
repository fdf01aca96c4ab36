import { describe, expect, it } from "vitest";
import { z } from "zod";
import * as layout from "@/lib/validation/layout";
import { controlCharacterIssues, controlCharacterMessage, parseInput } from "@/lib/validation/parse";
import * as scans from "@/lib/validation/scans";
import * as stamps from "@/lib/validation/stamps";
import * as users from "@/lib/validation/users";

type Path = (string | number)[];

/**
 * Every place a zod 4 schema reads text from its input: string, enum and string-literal leaves, and
 * coerced values (query strings and form fields arrive as text), with their paths.
 */
function textLeaves(schema: z.ZodType, path: Path = [], seen = new Set<z.ZodType>()): Path[] {
  // `seen` holds the schemas on the way down only (a guard against cycles): one schema may sit at two places.
  if (seen.has(schema)) return [];
  seen.add(schema);
  try {
    return leavesOf(schema, path, seen);
  } finally {
    seen.delete(schema);
  }
}

function leavesOf(schema: z.ZodType, path: Path, seen: Set<z.ZodType>): Path[] {
  const def = schema._zod.def as unknown as Record<string, unknown> & { type: string };
  const inner = (key: string, at: Path = path) => textLeaves(def[key] as z.ZodType, at, seen);
  switch (def.type) {
    case "string":
    case "enum":
    case "template_literal":
      return [path];
    case "literal":
      return (def.values as unknown[]).some((v) => typeof v === "string") ? [path] : [];
    case "number":
    case "boolean":
    case "bigint":
    case "date":
      return def.coerce ? [path] : [];
    case "object":
      return Object.entries(def.shape as Record<string, z.ZodType>).flatMap(([key, child]) => textLeaves(child, [...path, key], seen));
    case "array":
      return inner("element", [...path, 0]);
    case "optional":
    case "nullable":
    case "default":
    case "prefault":
    case "nonoptional":
    case "readonly":
    case "catch":
      return inner("innerType");
    case "pipe":
      // A preprocess is a pipe from a transform: the schema that reads the value is its second half.
      return (def.in as z.ZodType)._zod.def.type === "transform" ? inner("out") : inner("in");
    case "union":
      return (def.options as z.ZodType[]).flatMap((option) => textLeaves(option, path, seen));
    default:
      return [];
  }
}

/** An input that holds `value` at `path` and nothing else. */
function inputAt(path: Path, value: string): unknown {
  if (path.length === 0) return value;
  const [head, ...rest] = path;
  if (typeof head === "number") return [inputAt(rest, value)];
  return { [head]: inputAt(rest, value) };
}

const schemas = Object.entries({ layout, scans, stamps, users }).flatMap(([module, exports]) =>
  Object.entries(exports)
    .filter((entry): entry is [string, z.ZodType] => entry[1] instanceof z.ZodType)
    .map(([name, schema]) => ({ name: `${module}.${name}`, schema, leaves: [...new Map(textLeaves(schema).map((p) => [p.join("."), p])).values()] })),
);

const cases = schemas.flatMap(({ name, schema, leaves }) => leaves.map((path) => ({ name, schema, path, field: path.length ? path.join(".") : "(the whole value)" })));

describe("control characters in every input schema", () => {
  it("the walk finds the schemas and their text fields", () => {
    const fields = new Set(cases.map((c) => `${c.name}:${c.field}`));
    for (const expected of [
      "stamps.createStampSchema:name",
      "stamps.createStampSchema:notes",
      "stamps.createStampSchema:tags.0",
      "stamps.stampListQuerySchema:q",
      "stamps.checkoutSchema:workstation",
      "stamps.locationSchema:description",
      "users.inviteUserSchema:name",
      "users.createApiTokenSchema:name",
      "layout.layoutRequestSchema:stamp.code",
      "layout.layoutRequestSchema:stamp.outline",
      "scans.presignScanSchema:fileName",
    ]) {
      expect(fields, expected).toContain(expected);
    }
    expect(cases.length).toBeGreaterThan(80);
  });

  it.each(cases)("$name refuses a NUL in $field, naming the field", ({ schema, path }) => {
    const result = parseInput(schema, inputAt(path, "ab\u0000cd"));
    expect(result.success).toBe(false);
    const issue = result.error!.issues.find((i) => i.message === controlCharacterMessage);
    expect(issue?.path).toEqual(path);
  });
});

describe("the control-character rule", () => {
  it("lets tab, line feed and carriage return through, and ordinary Unicode", () => {
    expect(controlCharacterIssues({ notes: "one\ttwo\r\nthree · ꦧꦠꦶꦏ꧀ — 50 % ø" })).toEqual([]);
  });

  it.each([
    ["NUL", "\u0000"],
    ["bell", "\u0007"],
    ["escape", "\u001b"],
    ["vertical tab", "\u000b"],
    ["delete", "\u007f"],
    ["C1 next line", "\u0085"],
  ])("refuses %s, also deep in arrays and objects", (_name, ch) => {
    expect(controlCharacterIssues({ a: [{ b: `x${ch}` }] })).toMatchObject([{ path: ["a", 0, "b"], message: controlCharacterMessage }]);
  });

  it("refuses rather than strips: the parse fails, and other fields' problems are still reported", () => {
    const result = parseInput(stamps.locationSchema, { site: "Hall\u0000", code: "" });
    expect(result.success).toBe(false);
    const byField = Object.fromEntries(result.error!.issues.map((i) => [i.path.join("."), i.message]));
    expect(byField.site).toBe(controlCharacterMessage);
    expect(byField.code).toBe("validation.locationCode");
  });

  it("walks deeply nested input without overflowing the stack", () => {
    let deep: unknown = "x\u0000";
    for (let i = 0; i < 50_000; i++) deep = [deep];
    expect(controlCharacterIssues(deep)).toHaveLength(1);
  });
});
