// Which catalogue keys the code names. Pure text analysis of the sources (no TypeScript program), so it is
// fast and sees every file; see tests/unit/catalogue-usage.test.ts for the rules and DEVELOPERS.md ("Text").

export interface KeyUses {
  /** Keys named whole: `t("stamps.form.save")`, or `t("form.save")` in a file that asks for the "stamps" namespace. */
  exact: Set<string>;
  /** Keys built from a template, as patterns: `t(\`stamps.conditions.${c}\`)` → /^stamps\.conditions\.[^.]+$/. */
  patterns: RegExp[];
}

const escapeRegExp = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");

/** The namespaces a file asks for: useTranslations("x"), getTranslations("x") or getTranslations({ namespace: "x" }). */
export function namespacesOf(text: string): string[] {
  const found = new Set<string>();
  for (const m of text.matchAll(/(?:useTranslations|getTranslations)\(\s*["'`]([\w.-]+)["'`]/g)) found.add(m[1]);
  for (const m of text.matchAll(/getTranslations\(\s*\{[^}]*namespace:\s*["'`]([\w.-]+)["'`]/g)) found.add(m[1]);
  return [...found];
}

/**
 * Keys marked as used by a comment, for keys the code builds in a way the analysis cannot follow:
 * `// i18n-keys: stamps.saved.*, scans.kind.face`. A trailing `.*` marks everything under the prefix.
 */
export function markedKeys(text: string): { exact: string[]; prefixes: string[] } {
  const exact: string[] = [];
  const prefixes: string[] = [];
  for (const m of text.matchAll(/i18n-keys:\s*([^\n*]+(?:\*[^\n/]*)?)/g)) {
    for (const item of m[1].split(",").map((s) => s.trim().replace(/\s.*$/, ""))) {
      if (!item) continue;
      if (item.endsWith(".*")) prefixes.push(item.slice(0, -1));
      else exact.push(item);
    }
  }
  return { exact, prefixes };
}

/** String and template literals of a file: plain ones whole, templates as their static parts. */
export function literalsOf(text: string): { plain: string[]; templates: string[][] } {
  const plain: string[] = [];
  const templates: string[][] = [];
  for (const m of text.matchAll(/"((?:[^"\\\n]|\\.)*)"|'((?:[^'\\\n]|\\.)*)'/g)) plain.push(m[1] ?? m[2]);
  for (const m of text.matchAll(/`((?:[^`\\]|\\.)*)`/g)) {
    const parts = m[1].split(/\$\{[^}]*\}/);
    if (parts.length === 1) plain.push(parts[0]);
    else templates.push(parts);
  }
  return { plain, templates };
}

const looksLikeKey = (s: string) => /^[A-Za-z][\w:-]*(\.[\w:-]+)*$/.test(s);

/** Everything one file names as a key, with its own namespaces. */
export function keyUsesOf(text: string, uses: KeyUses = { exact: new Set(), patterns: [] }): KeyUses {
  const namespaces = ["", ...namespacesOf(text).map((n) => `${n}.`)];
  const { plain, templates } = literalsOf(text);
  for (const literal of plain) {
    if (!looksLikeKey(literal)) continue;
    for (const ns of namespaces) uses.exact.add(ns + literal);
  }
  for (const parts of templates) {
    // A template whose first part is empty (`${a}.title`) or holds no key text says nothing usable.
    if (!parts[0] || !/^[A-Za-z][\w.-]*$/.test(parts[0])) continue;
    if (!parts.every((p) => /^[\w.-]*$/.test(p))) continue;
    const body = parts.map(escapeRegExp).join("[\\w:-]+");
    for (const ns of namespaces) uses.patterns.push(new RegExp(`^${escapeRegExp(ns)}${body}$`));
  }
  const marked = markedKeys(text);
  for (const key of marked.exact) uses.exact.add(key);
  for (const prefix of marked.prefixes) uses.patterns.push(new RegExp(`^${escapeRegExp(prefix)}`));
  return uses;
}

export function isUsed(key: string, uses: KeyUses): boolean {
  return uses.exact.has(key) || uses.patterns.some((p) => p.test(key));
}
