import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { checkouts } from "@/db/schema";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, daysFromToday, uniquePrefix } from "../helpers/stamps";

let keeper: Session;
const prefix = uniquePrefix("RM");

beforeAll(async () => {
  const k = await createUser("keeper");
  keeper = (await signIn(k.email, k.password))!;
});

async function mailsTo(address: string): Promise<number> {
  const list = (await (await fetch(`${testEnv().mailUrl}/api/email`)).json()) as { to: { address: string }[] }[];
  return list.filter((m) => m.to.some((to) => to.address === address)).length;
}

async function overdue(label: string) {
  const stamp = await createStampRow({ code: `${prefix}-${label}` });
  const email = `${label.toLowerCase()}-${prefix.toLowerCase()}@capgrid.test`;
  const [row] = await db().insert(checkouts).values({ stampId: stamp.id, borrowerName: `Borrower ${label}`, borrowerEmail: email, workstation: "Table 1", dueOn: daysFromToday(-2) }).returning();
  return { stamp, email, checkoutId: row.id };
}

const waitForMail = async (email: string, count: number) => {
  for (let i = 0; i < 50 && (await mailsTo(email)) < count; i++) await new Promise((r) => setTimeout(r, 100));
};

describe("overdue reminders", () => {
  it("a second send within 24 hours skips the borrower, says so, and sends no second mail", async () => {
    const late = await overdue("TWICE");
    const first = await api("POST", "/api/v1/checkouts/reminders", { session: keeper });
    expect(first.body.reminders.sent.map((s: { code: string }) => s.code)).toContain(late.stamp.code);
    await waitForMail(late.email, 1);
    const [row] = await db().select().from(checkouts).where(eq(checkouts.id, late.checkoutId));
    expect(row.lastRemindedAt).not.toBeNull();

    const second = await api("POST", "/api/v1/checkouts/reminders", { session: keeper });
    expect(second.status).toBe(200);
    expect(second.body.reminders.sent.map((s: { code: string }) => s.code)).not.toContain(late.stamp.code);
    expect(second.body.reminders.skipped).toContainEqual({ code: late.stamp.code, borrowerName: "Borrower TWICE", lastRemindedAt: row.lastRemindedAt!.toISOString() });
    expect(second.body.reminders.gapHours).toBe(24);
    await new Promise((r) => setTimeout(r, 500));
    expect(await mailsTo(late.email)).toBe(1);
  });

  it("a borrower last reminded more than 24 hours ago is reminded again", async () => {
    const late = await overdue("AGAIN");
    await db().update(checkouts).set({ lastRemindedAt: new Date(Date.now() - 25 * 3_600_000) }).where(eq(checkouts.id, late.checkoutId));
    const res = await api("POST", "/api/v1/checkouts/reminders", { session: keeper });
    expect(res.body.reminders.sent.map((s: { code: string }) => s.code)).toContain(late.stamp.code);
    await waitForMail(late.email, 1);
    expect(await mailsTo(late.email)).toBe(1);
  });

  it("two sends at the same moment remind each borrower once", async () => {
    const late = await overdue("RACE");
    const [a, b] = await Promise.all([api("POST", "/api/v1/checkouts/reminders", { session: keeper }), api("POST", "/api/v1/checkouts/reminders", { session: keeper })]);
    const sent = [...a.body.reminders.sent, ...b.body.reminders.sent].filter((s: { code: string }) => s.code === late.stamp.code);
    expect(sent).toHaveLength(1);
    await waitForMail(late.email, 1);
    await new Promise((r) => setTimeout(r, 500));
    expect(await mailsTo(late.email)).toBe(1);
  });
});
