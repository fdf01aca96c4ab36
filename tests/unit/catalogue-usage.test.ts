import { describe, expect, it } from "vitest";
import { catalogueFiles } from "@/lib/i18n/messages";
import { isUsed, keyUsesOf, markedKeys, type KeyUses } from "../helpers/catalogue-usage";
import { catalogueLeaves, sourceFiles } from "../helpers/source-files";

// Every key of the catalogue is named by some code: whole (`t("stamps.form.save")`, or `t("form.save")` in a
// file that asks for the "stamps" namespace), built from a template (`t(\`stamps.conditions.${c}\`)`, which
// uses every key of that shape), or marked in a comment beside the code that builds it some other way
// (`// i18n-keys: stamps.saved.*`). A key nobody names is dead text that translators keep paying for.

const keys = [...catalogueLeaves(Object.assign({}, ...catalogueFiles.en)).keys()];

function allUses(): KeyUses {
  const uses: KeyUses = { exact: new Set(), patterns: [] };
  for (const { text } of sourceFiles()) keyUsesOf(text, uses);
  return uses;
}

describe("catalogue keys", () => {
  it("are each named by the code", () => {
    const uses = allUses();
    expect(keys.length).toBeGreaterThan(500);
    expect(keys.filter((key) => !isUsed(key, uses))).toEqual([]);
  });
});

describe("the usage check itself", () => {
  const uses = (text: string) => keyUsesOf(text);

  it("sees a key named whole, or inside the file's namespace", () => {
    expect(isUsed("stamps.form.save", uses(`t("stamps.form.save")`))).toBe(true);
    expect(isUsed("stamps.form.save", uses(`const t = useTranslations("stamps"); t("form.save")`))).toBe(true);
    expect(isUsed("stamps.form.save", uses(`const t = await getTranslations({ locale, namespace: "stamps" }); t('form.save')`))).toBe(true);
    expect(isUsed("stamps.form.save", uses(`const t = useTranslations("scans"); t("form.save")`))).toBe(false);
  });

  it("sees every key a template can build, and only those", () => {
    const u = uses("t(`stamps.conditions.${c}`); t(`roles.${role}.name`)");
    expect(isUsed("stamps.conditions.sound", u)).toBe(true);
    expect(isUsed("roles.keeper.name", u)).toBe(true);
    expect(isUsed("roles.keeper.summary", u)).toBe(false);
    expect(isUsed("stamps.faces.single", u)).toBe(false);
  });

  it("takes keys marked in a comment", () => {
    expect(markedKeys("// i18n-keys: stamps.saved.*, scans.kind.face")).toEqual({ exact: ["scans.kind.face"], prefixes: ["stamps.saved."] });
    expect(isUsed("stamps.saved.created", uses("// i18n-keys: stamps.saved.*"))).toBe(true);
  });

  it("finds a key nobody names", () => {
    expect(isUsed("stamps.form.neverShown", uses(`t("stamps.form.save")`))).toBe(false);
  });
});
