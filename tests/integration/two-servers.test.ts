import { type ChildProcess, spawn } from "node:child_process";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { checkouts } from "@/db/schema";
import { JOB_SCHEMA, REMINDERS } from "@/lib/jobs/queues";
import { waitForPort } from "@/scripts/lib/services";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { rawRequest, signIn } from "../helpers/http";
import { latestMailTo } from "../helpers/mail";
import { shapeScan } from "../helpers/scan-images";
import { uploadScan } from "../helpers/scan-upload";
import { createStampRow, uniquePrefix } from "../helpers/stamps";

// Two app servers on one database and one object store, as behind a load balancer: a second server (the same
// build, scripts/server.ts on another port, both origins in APP_ORIGINS) takes a session made on the first, the
// sign-in limit counts attempts on both together, and a scan uploaded through one shows on the other. Nothing
// lives on a server's own disk.
const prefix = uniquePrefix("TS");
let second: ChildProcess;
let secondUrl: string;
const setCookies = (headers: Record<string, string | string[] | undefined>) => ([] as string[]).concat(headers["set-cookie"] ?? []).map((c) => c.split(";")[0]);

beforeAll(async () => {
  const { appUrl } = testEnv();
  const port = Number(new URL(appUrl).port) + 5;
  secondUrl = `http://localhost:${port}`;
  second = spawn(join(process.cwd(), "node_modules", ".bin", "tsx"), [join(process.cwd(), "scripts", "server.ts"), "--port", String(port), "--host", "127.0.0.1"], {
    stdio: ["ignore", "ignore", "inherit"],
    env: { ...process.env, PORT: String(port), APP_ORIGINS: `${appUrl}, ${secondUrl}` },
    cwd: process.cwd(),
  });
  await waitForPort(port);
}, 120_000);
afterAll(() => {
  if (second && second.exitCode === null) second.kill("SIGTERM");
});

/** Signs in on one server from one client address; the session cookie, or null when refused. */
async function signInAt(base: string, address: string, email: string, password: string): Promise<string | null> {
  const csrf = await rawRequest(`${base}/api/auth/csrf`, { localAddress: address });
  const { csrfToken } = JSON.parse(csrf.text) as { csrfToken: string };
  const res = await rawRequest(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    localAddress: address,
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: setCookies(csrf.headers).join("; "), origin: base },
    body: new URLSearchParams({ csrfToken, email, password, callbackUrl: `${base}/` }).toString(),
  });
  return setCookies(res.headers).find((c) => c.includes("authjs.session-token=")) ?? null;
}

describe("two app servers", () => {
  it("a session made on the first works on the second", async () => {
    const user = await createUser("planner");
    const session = (await signIn(user.email, user.password))!;
    const me = await rawRequest(`${secondUrl}/api/v1/me`, { headers: { cookie: session.cookie } });
    expect(me.status).toBe(200);
    expect(JSON.parse(me.text).email).toBe(user.email);
    const first = await rawRequest(`${testEnv().appUrl}/api/v1/me`, { headers: { cookie: session.cookie } });
    expect(first.status).toBe(200);
  });

  it("counts wrong passwords on both servers together for the sign-in limit", async () => {
    const user = await createUser("keeper");
    const address = "127.0.0.7";
    // Ten wrong passwords, alternating between the servers, use up the address's attempts (10 per 15 minutes)…
    for (let i = 0; i < 10; i++) expect(await signInAt(i % 2 ? secondUrl : testEnv().appUrl, address, user.email, `wrong ${i}`)).toBeNull();
    // …so the right one is refused on either server, while another address still signs in.
    expect(await signInAt(secondUrl, address, user.email, user.password)).toBeNull();
    expect(await signInAt(testEnv().appUrl, address, user.email, user.password)).toBeNull();
    expect(await signInAt(secondUrl, "127.0.0.8", user.email, user.password)).not.toBeNull();
  }, 60_000);

  it("shows a scan uploaded through the first server on the second, thumbnail bytes and all", async () => {
    const keeper = await createUser("keeper");
    const session = (await signIn(keeper.email, keeper.password))!;
    const code = `${prefix}-SCAN`;
    await createStampRow({ code, widthMm: 100, heightMm: 100 });
    const { png } = await shapeScan({ dpi: 254, sideMm: 100, body: `<circle cx="50" cy="50" r="30"/>`, ink: "#1c1917", ground: "#ffffff" });
    const uploaded = await uploadScan(session, code, png);
    const list = await rawRequest(`${secondUrl}/api/v1/stamps/${code}/scans`, { headers: { cookie: session.cookie } });
    expect(list.status).toBe(200);
    const scans = JSON.parse(list.text).scans as { id: string; urls: { thumb: string } }[];
    expect(scans.map((s) => s.id)).toContain(uploaded.scan.id);
    const thumb = await fetch(new URL(scans[0].urls.thumb, secondUrl), { headers: { cookie: session.cookie } });
    expect(thumb.status).toBe(200);
    expect((await thumb.arrayBuffer()).byteLength).toBeGreaterThan(100);
  }, 60_000);

  it("runs a job once, though both servers work the queue", async () => {
    const stamp = await createStampRow({ code: `${prefix}-LATE` });
    const email = `late-${prefix.toLowerCase()}@example.test`;
    const yesterday = new Date(Date.now() - 2 * 86_400_000).toISOString().slice(0, 10);
    await db().insert(checkouts).values({ stampId: stamp.id, borrowerName: "Late borrower", borrowerEmail: email, workstation: "Table 9", dueOn: yesterday });
    // A client of the queue only (no workers, no schedules): what another service would use to hand work over.
    const boss = new PgBoss({ connectionString: process.env.DATABASE_URL!, schema: JOB_SCHEMA, supervise: false, schedule: false });
    await boss.start();
    try {
      const queue = await boss.getQueue(REMINDERS);
      expect(queue).toMatchObject({ retryLimit: 3, retryBackoff: true });
      const id = (await boss.send(REMINDERS, {}))!;
      await expect.poll(async () => (await boss.getJobById(REMINDERS, id))?.state, { timeout: 30_000, interval: 250 }).toBe("completed");
      await latestMailTo(email, /./);
      // Both servers write to the same log (LOG_FILE): the job ran on exactly one of them, once.
      const done = readFileSync(process.env.LOG_FILE!, "utf8")
        .split("\n")
        .filter(Boolean)
        .map((l) => JSON.parse(l) as { event?: string; jobId?: string; pid?: number })
        .filter((l) => l.event === "job.done" && l.jobId === id);
      expect(done).toHaveLength(1);
      const { mailUrl } = testEnv();
      const all = (await (await fetch(`${mailUrl}/api/email`)).json()) as { to: { address: string }[] }[];
      expect(all.filter((m) => m.to.some((t) => t.address === email))).toHaveLength(1);
    } finally {
      await boss.stop({ graceful: false });
    }
  }, 90_000);
});
