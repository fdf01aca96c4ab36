import { describe, expect, it } from "vitest";
import type { z } from "zod";
import { translator } from "@/lib/i18n/translator";
import { issueFields } from "@/lib/error-body";
import { formFields } from "@/lib/actions/form-fields";
import { createStampSchema } from "@/lib/validation/stamps";
import { inviteUserSchema, setPasswordSchema } from "@/lib/validation/users";

const t = translator("en");
const fieldsOf = (schema: z.ZodType, value: unknown) => {
  const result = schema.safeParse(value, { reportInput: true });
  if (result.success) throw new Error("expected the value to be refused");
  return issueFields(result.error.issues, t);
};

describe("translated validation messages", () => {
  it("say per field what is wrong", () => {
    const fields = fieldsOf(inviteUserSchema, { email: "nope", name: "  ", role: "boss" });
    expect(fields.email).toEqual(["Enter an e-mail address like name@example.com."]);
    expect(fields.name).toEqual(["Required."]);
    expect(fields.role[0]).toMatch(/^Choose one of: admin, keeper/);
  });
  it("call a missing field required", () => {
    expect(fieldsOf(inviteUserSchema, {}).email).toEqual(["Required."]);
  });
  it("check that the two passwords match, on the second field", () => {
    const fields = fieldsOf(setPasswordSchema, { token: "x".repeat(40), password: "long enough pass", confirm: "other" });
    expect(fields.confirm).toEqual(["The two passwords differ."]);
  });
  it("refuse short passwords with the minimum", () => {
    expect(fieldsOf(setPasswordSchema, { token: "x".repeat(40), password: "short", confirm: "short" }).password).toEqual(["Use at least 10 characters."]);
  });
  it("list a message once when two checks of one field fail alike (outline path: its characters and its start)", () => {
    const fields = fieldsOf(createStampSchema, { code: "OK-1", name: "x", widthMm: 100, heightMm: 100, outlinePath: "circle r=5" });
    expect(fields.outlinePath).toEqual(["Use SVG path data in mm (commands M, L, H, V, C, S, Q, T, A, Z and numbers)."]);
  });
});

describe("a form's own fields", () => {
  it("leave out the hidden inputs React adds to a server action's form", () => {
    const submitted = new FormData();
    submitted.append("$ACTION_REF_56", "");
    submitted.append("$ACTION_56:0", '{"id":"abc","bound":"$@1"}');
    submitted.append("$ACTION_KEY", "k0");
    submitted.append("site", "Griya Kidul");
    submitted.append("code", "R1-S1");
    expect(Object.fromEntries(formFields(submitted).entries())).toEqual({ site: "Griya Kidul", code: "R1-S1" });
  });
});
