import { z } from "@/lib/zod";

// The one way an input from outside is parsed: JSON bodies, query strings, route params, form data
// and CSV rows all come through `parseInput`, so a rule that holds for every input lives here.

/**
 * Control characters (Unicode category Cc: U+0000–U+001F, U+007F–U+009F) except tab, line feed and
 * carriage return. PostgreSQL text cannot hold U+0000 at all, and the others are never meant in a
 * name, a note or a search, so they are refused (with the field named), never silently stripped.
 */
const CONTROL_CHARACTER = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/;
export const controlCharacterMessage = "validation.controlCharacter";

/**
 * One issue per string in a raw input (nested objects and arrays included) that holds a control
 * character, at that string's path. Walks with its own stack, so deep nesting cannot overflow it.
 */
export function controlCharacterIssues(value: unknown, basePath: PropertyKey[] = []): z.core.$ZodIssue[] {
  // Each entry links to its parent, so a path is built only for the rare string that is refused.
  type Step = { item: unknown; key?: PropertyKey; parent?: Step };
  const pathOf = (step: Step) => {
    const path: PropertyKey[] = [];
    for (let s: Step | undefined = step; s?.parent; s = s.parent) path.unshift(s.key!);
    return [...basePath, ...path];
  };
  const issues: z.core.$ZodIssue[] = [];
  const stack: Step[] = [{ item: value }];
  // Linear in the size of the input, which the body limit bounds (lib/api/body.ts).
  while (stack.length) {
    const step = stack.pop()!;
    const { item } = step;
    if (typeof item === "string") {
      if (CONTROL_CHARACTER.test(item)) issues.push({ code: "custom", path: pathOf(step), message: controlCharacterMessage, input: item });
    } else if (Array.isArray(item)) {
      for (let i = item.length - 1; i >= 0; i--) stack.push({ item: item[i], key: i, parent: step });
    } else if (item !== null && typeof item === "object") {
      for (const [key, child] of Object.entries(item).reverse()) stack.push({ item: child, key, parent: step });
    }
  }
  return issues;
}

const pathKey = (path: readonly PropertyKey[]) => path.map(String).join(".");

/**
 * Parses an input from outside with its schema, after refusing control characters in any of its
 * strings. Issues from the schema on other fields are kept, so a form still shows every problem.
 */
export function parseInput<S extends z.ZodType>(schema: S, value: unknown): z.ZodSafeParseResult<z.output<S>> {
  const control = controlCharacterIssues(value);
  const parsed = schema.safeParse(value, { reportInput: true });
  if (control.length === 0) return parsed;
  const refused = new Set(control.map((issue) => pathKey(issue.path)));
  const others = parsed.success ? [] : parsed.error.issues.filter((issue) => !refused.has(pathKey(issue.path)));
  return { success: false, error: new z.ZodError([...control, ...others]) } as z.ZodSafeParseResult<z.output<S>>;
}
