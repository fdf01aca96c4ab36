import { describe, expect, it } from "vitest";
import type { z } from "zod";
import { translator } from "@/lib/i18n/translator";
import { issueFields } from "@/lib/error-body";
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
});
