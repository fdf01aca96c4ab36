import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { signInFailures } from "@/db/schema";
import { requestPasswordReset, setPasswordWithToken } from "@/lib/data/users";
import { createUser, db } from "../helpers/db";
import { signInFrom } from "../helpers/http";
import { latestMailTo, linkIn, tokenOf } from "../helpers/mail";

// The app sees the client's address from its own socket (scripts/server.ts). Linux answers on all of
// 127.0.0.0/8, so binding the client to 127.0.0.2 makes a second machine on the same host.
const STRANGER = "127.0.0.2";
const OWNER = "127.0.0.1";

/** Every password check that fails writes one row; with wrong passwords only, rows = checks. */
const passwordChecks = async (email: string) => (await db().select().from(signInFailures).where(eq(signInFailures.email, email.toLowerCase()))).length;

describe("the sign-in limit", () => {
  it("holds under 30 parallel wrong passwords (at most 10 checked), and the owner from another address still signs in", async () => {
    const owner = await createUser("keeper");
    const tries = await Promise.all(Array.from({ length: 30 }, (_, i) => signInFrom(STRANGER, owner.email, `guess number ${i}`)));
    expect(tries.every((t) => t === null)).toBe(true);
    expect(await passwordChecks(owner.email)).toBeLessThanOrEqual(10);
    expect(await passwordChecks(owner.email)).toBeGreaterThan(0);

    // The stranger stays limited, even with the right password…
    expect(await signInFrom(STRANGER, owner.email, owner.password)).toBeNull();
    // …and cannot pass for another client by sending a forwarded-for header (the app takes the socket's address).
    expect(await signInFrom(STRANGER, owner.email, owner.password, { "x-forwarded-for": OWNER, "x-real-ip": OWNER, "x-capgrid-client-address": OWNER })).toBeNull();
    expect(await passwordChecks(owner.email)).toBeLessThanOrEqual(10);

    // The owner, from their own address, is slowed down at most, never locked out.
    expect(await signInFrom(OWNER, owner.email, owner.password)).not.toBeNull();
  });

  it("a stranger using several addresses slows the account down, but never locks the owner out", async () => {
    const owner = await createUser("waxmaster");
    const addresses = ["127.0.0.3", "127.0.0.4", "127.0.0.5"];
    const tries = addresses.flatMap((address) => Array.from({ length: 12 }, (_, i) => signInFrom(address, owner.email, `guess ${address} ${i}`)));
    expect((await Promise.all(tries)).every((t) => t === null)).toBe(true);
    // 10 checks per address, 30 in all: the account is over its ceiling, so each further check waits…
    expect(await passwordChecks(owner.email)).toBe(30);
    // …and the owner still gets in.
    expect(await signInFrom(OWNER, owner.email, owner.password)).not.toBeNull();
  });

  it("a client that tries to choose its own address with headers is still counted by its socket", async () => {
    const user = await createUser("planner");
    const spoofs = Array.from({ length: 12 }, (_, i) => ({ "x-forwarded-for": `10.9.8.${i}`, "x-capgrid-client-address": `10.9.9.${i}` }));
    for (const [i, headers] of spoofs.entries()) await signInFrom(STRANGER, user.email, `wrong ${i}`, headers);
    expect(await passwordChecks(user.email)).toBe(10);
  });

  it("leaves the reset link by e-mail open while limited, and a new password lifts the limit", async () => {
    const user = await createUser("designer");
    for (let i = 0; i < 11; i++) await signInFrom(OWNER, user.email, `wrong ${i}`);
    expect(await signInFrom(OWNER, user.email, user.password)).toBeNull();

    await requestPasswordReset(user.email);
    const token = tokenOf(linkIn(await latestMailTo(user.email, /reset/i)));
    await setPasswordWithToken(token, "a fresh passphrase after the limit");
    expect(await signInFrom(OWNER, user.email, "a fresh passphrase after the limit")).not.toBeNull();
  });
});
