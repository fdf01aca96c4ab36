import { describe, expect, it } from "vitest";
import { computeLayout } from "@/lib/layout";

const outline = "M20 20 H120 A40 40 0 0 1 160 60 V140 H20 Z M40 40 H70 V70 H40 Z";

function render(extra: Record<string, unknown> = {}) {
  return computeLayout({
    cloth: { widthMm: 1150, lengthMm: 5000, margins: { leftMm: 30, rightMm: 30 } },
    stamp: { widthMm: 180, heightMm: 160, outline, fillRule: "evenodd" },
    arrangement: "half-drop",
    edges: "clip",
    preview: true,
    impressions: true,
    ...extra,
  });
}

describe("SVG preview", () => {
  it("draws one placed wax shape and one footprint per front impression of the window", () => {
    const r = render();
    const svg = r.preview!;
    const front = r.impressions!.filter((i) => i.face === "front");
    expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
    expect(svg.endsWith("</svg>")).toBe(true);
    expect(svg.match(/<use /g)).toHaveLength(front.length);
    expect(svg.match(/<rect [^>]*stroke-dasharray/g)).toHaveLength(front.filter((i) => !i.whole).length);
    expect(svg).toContain(`d="${outline}" fill-rule="evenodd"`);
    expect(svg).toContain('viewBox="0 0 1150 1000"');
    expect(svg).not.toMatch(/NaN|undefined|Infinity/);
  });

  it("balances its tags", () => {
    const svg = render().preview!;
    const opened = (svg.match(/<(svg|defs|g|clipPath)[ >]/g) ?? []).length;
    const closed = (svg.match(/<\/(svg|defs|g|clipPath)>/g) ?? []).length;
    expect(opened).toBe(closed);
  });

  it("shows the chosen window and only the impressions reaching into it", () => {
    const r = render({ window: { startMm: 2000, lengthMm: 500 } });
    expect(r.window).toEqual({ startMm: 2000, endMm: 2500 });
    expect(r.preview).toContain('viewBox="0 2000 1150 500"');
    for (const i of r.impressions!) {
      expect(i.yMm).toBeLessThan(2500);
      expect(i.yMm + i.heightMm).toBeGreaterThan(2000);
    }
  });

  it("leaves the preview and the list out unless asked", () => {
    const r = render({ preview: false, impressions: false });
    expect(r.preview).toBeUndefined();
    expect(r.impressions).toBeUndefined();
  });

  it("draws a bare footprint at the coverage ratio's opacity when there is no outline", () => {
    const r = render({ stamp: { widthMm: 180, heightMm: 160, coverage: 0.45 } });
    expect(r.preview).toContain('d="M0 0H180V160H0Z"');
    expect(r.preview).toContain('fill-opacity="0.45"');
  });
});
