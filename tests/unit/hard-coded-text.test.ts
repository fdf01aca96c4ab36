import ts from "typescript";
import { describe, expect, it } from "vitest";
import { sourceFiles } from "../helpers/source-files";

// No words in a component outside the catalogues: JSX text and the props people read or hear (placeholder,
// aria-label, title, alt, …) must come from t(…). What may stand in code is what reads the same in every
// language: symbols, units and codes (the allow-list below). Found by parsing every .tsx file with TypeScript.

const spokenProps = new Set(["placeholder", "aria-label", "aria-description", "aria-roledescription", "aria-valuetext", "title", "alt", "label", "emptyOption", "intro", "hint"]);

/** Words that are the same in both languages: units, file formats, standards and the product's name. */
const sameInEveryLanguage = new Set(["mm", "cm", "m", "in", "yd", "g", "kg", "oz", "lb", "px", "DPI", "m²", "°C", "°F", "g/m", "g/m²", "QR", "SVG", "PNG", "JPEG", "TIFF", "WebP", "CSV", "JSON", "API", "URL", "Otsu", "Capgrid", "x", "×"]);

const hasLetters = (text: string) => /\p{L}/u.test(text);
const allowed = (text: string) => !hasLetters(text) || text.split(/[\s·,;:()/–—-]+/).filter(hasLetters).every((word) => sameInEveryLanguage.has(word));

export function hardCodedText(fileName: string, source: string): string[] {
  const file = ts.createSourceFile(fileName, source, ts.ScriptTarget.Latest, true, ts.ScriptKind.TSX);
  const found: string[] = [];
  const report = (node: ts.Node, text: string) => {
    const { line } = file.getLineAndCharacterOfPosition(node.getStart());
    found.push(`${fileName}:${line + 1}: ${JSON.stringify(text.trim())}`);
  };
  const stringOf = (node: ts.Node | undefined): string | null => {
    if (!node) return null;
    if (ts.isStringLiteral(node) || ts.isNoSubstitutionTemplateLiteral(node)) return node.text;
    if (ts.isJsxExpression(node)) return stringOf(node.expression);
    if (ts.isParenthesizedExpression(node)) return stringOf(node.expression);
    return null;
  };
  const visit = (node: ts.Node) => {
    if (ts.isJsxText(node)) {
      const text = node.getText();
      if (text.trim() && !allowed(text)) report(node, text);
    } else if (ts.isJsxExpression(node) && node.parent && (ts.isJsxElement(node.parent) || ts.isJsxFragment(node.parent))) {
      // {"Text"} or {cond ? "Yes" : "No"} as a child
      const literals: ts.Node[] = [];
      const collect = (n: ts.Node) => {
        if (ts.isStringLiteral(n) || ts.isNoSubstitutionTemplateLiteral(n)) literals.push(n);
        else if (ts.isConditionalExpression(n)) [n.whenTrue, n.whenFalse].forEach(collect);
        else if (ts.isBinaryExpression(n) && (n.operatorToken.kind === ts.SyntaxKind.BarBarToken || n.operatorToken.kind === ts.SyntaxKind.QuestionQuestionToken || n.operatorToken.kind === ts.SyntaxKind.AmpersandAmpersandToken)) [n.left, n.right].forEach(collect);
        else if (ts.isParenthesizedExpression(n)) collect(n.expression);
      };
      if (node.expression) collect(node.expression);
      for (const literal of literals) {
        const text = stringOf(literal)!;
        if (!allowed(text)) report(literal, text);
      }
    } else if (ts.isJsxAttribute(node) && spokenProps.has(node.name.getText())) {
      const text = stringOf(node.initializer);
      if (text !== null && !allowed(text)) report(node, text);
    }
    ts.forEachChild(node, visit);
  };
  visit(file);
  return found;
}

describe("components", () => {
  it("show no hard-coded words: text and spoken props come from the catalogues", () => {
    const files = sourceFiles(["app", "components"]).filter((f) => f.path.endsWith(".tsx"));
    expect(files.length).toBeGreaterThan(30);
    expect(files.flatMap((f) => hardCodedText(f.path, f.text))).toEqual([]);
  });
});

describe("the hard-coded text check itself", () => {
  const check = (source: string) => hardCodedText("sample.tsx", source);

  it("finds words in JSX text, in a string child and in a spoken prop", () => {
    expect(check(`export const A = () => <p>Save the stamp</p>;`)).toEqual([`sample.tsx:1: "Save the stamp"`]);
    expect(check(`export const A = ({ ok }) => <p>{ok ? "Saved" : t("x")}</p>;`)).toEqual([`sample.tsx:1: "Saved"`]);
    expect(check(`export const A = () => <input placeholder="e.g. CP-0142" />;`)).toEqual([`sample.tsx:1: "e.g. CP-0142"`]);
    expect(check(`export const A = () => <img alt={"A stamp"} src="/a.png" />;`)).toEqual([`sample.tsx:1: "A stamp"`]);
  });

  it("lets through text from t(…), symbols, units and codes", () => {
    expect(check(`export const A = ({ t }) => <p title={t("x")}>{t("y")} · 35 % — 210 × 200 mm</p>;`)).toEqual([]);
    expect(check(`export const A = () => <p>{"—"} DPI <span className="font-mono">PNG</span></p>;`)).toEqual([]);
    expect(check(`export const A = () => <div className="text-stone-500" data-testid="facts" />;`)).toEqual([]);
  });
});
