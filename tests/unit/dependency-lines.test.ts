import { describe, expect, it } from "vitest";
import { lineRange, lineReport } from "@/scripts/lib/dependency-lines";

// The line rule is semver's caret range (semver.org and the npm docs on ranges): ^16.4.6 stays below 17.0.0; for
// 0.x the minor is the line (~0.45.4 stays below 0.46.0).
describe("dependency lines", () => {
  it("takes the major as the line, the minor for 0.x", () => {
    expect(lineRange("16.4.6")).toBe("^16.4.6");
    expect(lineRange("0.45.4")).toBe("~0.45.4");
  });
  it("finds the newest release of the line, leaving prereleases and the next major out", () => {
    const r = lineReport("next", "16.4.6", ["16.4.5", "16.4.6", "16.4.7", "16.5.0-canary.3", "16.5.1", "17.0.0"]);
    expect(r).toMatchObject({ newestOfLine: "16.5.1", newest: "17.0.0", status: "behind" });
  });
  it("says current when the pinned version is the newest of its line", () => {
    expect(lineReport("drizzle-orm", "0.45.4", ["0.45.3", "0.45.4", "0.46.0"]).status).toBe("current");
  });
  it("follows a prerelease pin through its prereleases to the release of its major", () => {
    expect(lineReport("next-auth", "5.0.0-beta.32", ["4.24.15", "5.0.0-beta.31", "5.0.0-beta.32"]).status).toBe("current");
    expect(lineReport("next-auth", "5.0.0-beta.32", ["5.0.0-beta.32", "5.0.0-beta.33"])).toMatchObject({ newestOfLine: "5.0.0-beta.33", status: "behind" });
  });
  it("says unknown when the registry gave nothing", () => {
    expect(lineReport("sharp", "0.34.5", []).status).toBe("unknown");
  });
});
