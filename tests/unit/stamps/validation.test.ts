import { describe, expect, it } from "vitest";
import { queryObject } from "@/lib/validation/common";
import { checkoutSchema, createStampSchema, stampListQuerySchema, updateStampSchema } from "@/lib/validation/stamps";

const base = { code: "cp-0142", name: " Parang ", widthMm: 210.04, heightMm: 200 };

describe("stamp schemas", () => {
  it("normalise the code to upper case, round lengths to 0.1 mm and fill the defaults", () => {
    const parsed = createStampSchema.parse(base);
    expect(parsed).toMatchObject({ code: "CP-0142", name: "Parang", widthMm: 210, face: "single", mirrored: false, condition: "sound", tags: [], impressionsCount: 0 });
  });

  it("need a pair for a twin, and a twin other than the stamp itself", () => {
    const single = createStampSchema.safeParse({ ...base, twinCode: "CP-1" });
    expect(single.error?.issues[0]).toMatchObject({ path: ["twinCode"], message: "validation.twinNeedsPair" });
    const self = createStampSchema.safeParse({ ...base, face: "pair", twinCode: "CP-0142" });
    expect(self.error?.issues[0].message).toBe("validation.twinSelf");
  });

  it("a change needs a version and at least one field", () => {
    expect(updateStampSchema.safeParse({ name: "x" }).success).toBe(false);
    expect(updateStampSchema.safeParse({ version: 2 }).error?.issues[0].message).toBe("validation.nothingToChange");
    // No defaults sneak into a change: a rename must not reset the condition or the tags.
    expect(updateStampSchema.parse({ version: 2, maker: "" })).toEqual({ version: 2, maker: null });
  });

  it("refuse a future date of making and an outline that is not path data", () => {
    expect(createStampSchema.safeParse({ ...base, madeOn: "2999-01-01" }).error?.issues[0].message).toBe("validation.dateInFuture");
    expect(createStampSchema.safeParse({ ...base, madeOn: "2020-02-30" }).error?.issues[0].message).toBe("validation.date");
    expect(createStampSchema.safeParse({ ...base, outlinePath: "<script>" }).success).toBe(false);
    expect(createStampSchema.parse({ ...base, outlinePath: "M0 0 L10 0 L10 10 Z" }).outlinePath).toBe("M0 0 L10 0 L10 10 Z");
  });
});

describe("list query", () => {
  it("reads comma lists, repeated keys, booleans and numbers from the query string", () => {
    const params = new URLSearchParams("condition=sound&condition=worn&out=true&minWidthMm=180&sort=-width&page=2&q=");
    expect(stampListQuerySchema.parse(queryObject(params))).toMatchObject({ condition: ["sound", "worn"], out: true, minWidthMm: 180, sort: "-width", page: 2, pageSize: 50 });
  });

  it("refuses a reversed size range and an oversized page", () => {
    const result = stampListQuerySchema.safeParse({ minWidthMm: "300", maxWidthMm: "200", pageSize: "1000" });
    expect(result.error?.issues.map((i) => i.path.join(".")).sort()).toEqual(["maxWidthMm", "pageSize"]);
  });
});

describe("check-out", () => {
  const today = new Date().toISOString().slice(0, 10);
  it("needs a person and a due date from today on", () => {
    expect(checkoutSchema.safeParse({ workstation: "T1", dueOn: today }).error?.issues[0]).toMatchObject({ path: ["borrowerName"], message: "validation.borrowerNeeded" });
    expect(checkoutSchema.safeParse({ borrowerName: "Sari", workstation: "T1", dueOn: "2000-01-01" }).error?.issues[0].message).toBe("validation.dueDatePast");
    expect(checkoutSchema.parse({ borrowerName: "Sari", borrowerEmail: "", workstation: "T1", dueOn: today })).toMatchObject({ borrowerEmail: null });
  });
});
