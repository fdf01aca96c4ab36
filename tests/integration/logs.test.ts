import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { createUser } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn } from "../helpers/http";
import { createStampRow, uniquePrefix } from "../helpers/stamps";

// The structured log (lib/log.ts, one JSON line per event in LOG_FILE for the test app): sign-ins, failed sign-ins,
// permission denials and deletions say who and when, and never carry the password.
const prefix = uniquePrefix("LG");

function lines(): Record<string, unknown>[] {
  const file = process.env.LOG_FILE;
  if (!file) throw new Error("LOG_FILE is set by the test stack (scripts/lib/test-stack.ts)");
  return readFileSync(file, "utf8")
    .split("\n")
    .filter(Boolean)
    .map((l) => JSON.parse(l));
}

const waitFor = async (find: (l: Record<string, unknown>) => boolean) => {
  await expect.poll(() => lines().find(find), { timeout: 10_000 }).toBeDefined();
  return lines().filter(find).at(-1)!;
};

describe("the structured log", () => {
  it("records a failed sign-in with the e-mail and the reason, never the password, and a successful one", async () => {
    testEnv();
    const user = await createUser("keeper");
    const wrong = `${prefix}-not-the-password`;
    expect(await signIn(user.email, wrong)).toBeNull();
    const failed = await waitFor((l) => l.event === "signIn.failed" && l.email === user.email.toLowerCase());
    expect(failed).toMatchObject({ reason: "wrongPassword", level: 40, who: { id: user.id, role: "keeper" } });
    expect(typeof failed.time).toBe("string");
    expect(readFileSync(process.env.LOG_FILE!, "utf8")).not.toContain(wrong);
    expect(await signIn(user.email, user.password)).not.toBeNull();
    await waitFor((l) => l.event === "signIn.succeeded" && (l.who as { id: string }).id === user.id);
    expect(readFileSync(process.env.LOG_FILE!, "utf8")).not.toContain(user.password);
  });

  it("records a permission denial with the actor and the permission, and a deletion with who deleted what", async () => {
    const designer = await createUser("designer");
    const keeper = await createUser("keeper");
    const d = (await signIn(designer.email, designer.password))!;
    const k = (await signIn(keeper.email, keeper.password))!;
    const stamp = await createStampRow({ code: `${prefix}-DEL` });
    const denied = await api("DELETE", `/api/v1/stamps/${stamp.code}`, { session: d });
    expect(denied.status).toBe(403);
    await waitFor((l) => l.event === "permission.denied" && (l.who as { id: string }).id === designer.id && l.permission === "stamps:write");
    const deleted = await api("DELETE", `/api/v1/stamps/${stamp.code}`, { session: k });
    expect(deleted.status).toBe(204);
    await waitFor((l) => l.event === "record.deleted" && l.kind === "stamp" && l.code === stamp.code && (l.who as { id: string }).id === keeper.id);
  });
});
