import { readFileSync } from "node:fs";
import { join } from "node:path";
import { eq } from "drizzle-orm";
import postgres from "postgres";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { users } from "@/db/schema";
import { can, permissionTable, roles, type Permission, type Role } from "@/lib/permissions";
import { tableFigures, type TableFigures } from "@/scripts/lib/backup";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn, type Session } from "../helpers/http";

// The authorization matrix. Every /api/v1 route and method the app serves (read from its own openapi.json, which
// is built from every route file: tests/integration/openapi.test.ts holds that) × every role, signed out, a
// disabled user and a revoked API token, on records that do not exist: each answer is checked against
// lib/permissions.ts (a role the table leaves out gets 403, a role it names never gets 401 or 403, the others
// 401), and the denied requests change no row. Every server action of the build is listed below with the
// permission its source checks on the server; an action without an entry fails the test.

type Op = { path: string; method: string; permission: Permission };
const sessions = {} as Record<Role, Session>;
let disabled: Session;
let revokedToken: string;
let ops: Op[] = [];
const sql = () => postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
let conn: ReturnType<typeof sql>;

// Rows that every request may touch by design: the session's last-seen time, a token's last use, sign-in counters.
const volatile = new Set(["public.user_sessions", "public.api_tokens", "public.sign_in_counters", "public.sign_in_failures"]);
const figures = async (): Promise<Record<string, TableFigures>> => Object.fromEntries(Object.entries(await tableFigures(conn)).filter(([t]) => !volatile.has(t)));

/** A record that is not there, for each kind of path parameter. */
const missing = (name: string) => (name === "code" ? "ZZ-NONE-0" : "00000000-0000-4000-8000-000000000000");
const urlOf = (path: string) => path.replace(/\{(\w+)\}/g, (_, name: string) => encodeURIComponent(missing(name)));

async function call(op: Op, who: { session?: Session; token?: string }) {
  const withBody = op.method === "POST" || op.method === "PUT" || op.method === "PATCH";
  return api(op.method, urlOf(op.path), { ...who, ...(withBody ? { body: {} } : {}) });
}

beforeAll(async () => {
  testEnv();
  conn = sql();
  for (const role of roles) {
    const u = await createUser(role);
    sessions[role] = (await signIn(u.email, u.password))!;
  }
  const gone = await createUser("admin");
  disabled = (await signIn(gone.email, gone.password))!;
  await db().update(users).set({ disabled: true }).where(eq(users.id, gone.id));
  const made = await api("POST", "/api/v1/tokens", { session: sessions.admin, body: { name: "matrix token" } });
  expect(made.status, JSON.stringify(made.body)).toBe(201);
  revokedToken = made.body.token.secret;
  expect(typeof revokedToken).toBe("string");
  const revoke = await api("DELETE", `/api/v1/tokens/${made.body.token.id}`, { session: sessions.admin });
  expect(revoke.status).toBe(204);

  const doc = (await api("GET", "/api/v1/openapi.json", { session: sessions.admin })).body as { paths: Record<string, Record<string, { "x-permission": Permission }>> };
  ops = Object.entries(doc.paths).flatMap(([path, methods]) => Object.entries(methods).map(([method, op]) => ({ path, method: method.toUpperCase(), permission: op["x-permission"] })));
});
afterAll(async () => {
  await conn?.end();
});

/** Writes that an empty body may make on purpose (a reminder run, …); anything else answering 2xx is a finding. */
const allowedEmptyWrites: string[] = [
  // Sends today's overdue reminders (the same as `npm run remind`): it takes no input at all.
  "POST /api/v1/checkouts/reminders",
];

describe("every route × every caller", () => {
  it("covers every route and method the app documents, each with a permission from the table", () => {
    expect(ops.length).toBeGreaterThan(80);
    for (const op of ops) expect(Object.keys(permissionTable), `${op.method} ${op.path}`).toContain(op.permission);
  });

  it("answers as lib/permissions.ts says for every role, signed out, disabled and with a revoked token; denied requests change no row", async () => {
    const mismatches: string[] = [];
    const wrote = new Set<string>();
    for (const op of ops) {
      const before = await figures();
      const deniedRoles = roles.filter((r) => !can(r, op.permission));
      for (const role of deniedRoles) {
        const res = await call(op, { session: sessions[role] });
        if (res.status !== 403) mismatches.push(`${op.method} ${op.path} as ${role}: ${res.status}, expected 403`);
      }
      for (const [who, caller] of [["signed out", {}], ["a disabled user", { session: disabled }], ["a revoked token", { token: revokedToken }]] as const) {
        const res = await call(op, caller);
        if (res.status !== 401) mismatches.push(`${op.method} ${op.path} ${who}: ${res.status}, expected 401`);
      }
      const after = await figures();
      for (const [table, f] of Object.entries(after)) {
        const was = before[table];
        if (!was || was.rows !== f.rows || was.checksum !== f.checksum) mismatches.push(`${op.method} ${op.path}: a denied request changed ${table}`);
      }
      for (const role of roles.filter((r) => can(r, op.permission))) {
        const res = await call(op, { session: sessions[role] });
        if (res.status === 401 || res.status === 403) mismatches.push(`${op.method} ${op.path} as ${role}: ${res.status}, but the table lets ${role} in`);
        if (res.status >= 500) mismatches.push(`${op.method} ${op.path} as ${role}: ${res.status} on a missing record or an empty body`);
        if (op.method !== "GET" && res.status < 300) wrote.add(`${op.method} ${op.path}`);
      }
    }
    expect(mismatches).toEqual([]);
    // An empty body on a missing record changes nothing anywhere, except these, which need neither.
    expect([...wrote].sort()).toEqual(allowedEmptyWrites);
  }, 600_000);
});

// Every server action, with what its source checks on the server before it does anything: the permissions it
// asks requirePermission for, or "public" (the sign-in pages and the language switch: no account yet).
const actionChecks: Record<string, Permission[] | "public"> = {
  "app/(app)/account/actions.ts#updateProfileAction": ["account:self"],
  "app/(app)/account/actions.ts#signOutEverywhereAction": ["account:self"],
  "app/(app)/admin/actions.ts#inviteUserAction": ["users:manage"],
  "app/(app)/admin/actions.ts#userRowAction": ["users:manage"],
  "app/(app)/admin/actions.ts#revokeTokenAction": ["users:manage"],
  "app/(app)/admin/settings/actions.ts#updateSettingsAction": ["settings:manage"],
  "app/(app)/motifs/actions.ts#createMotifAction": ["motifs:write"],
  "app/(app)/motifs/actions.ts#updateMotifAction": ["motifs:write"],
  "app/(app)/motifs/actions.ts#copyMotifAction": ["motifs:write"],
  "app/(app)/motifs/actions.ts#deleteMotifAction": ["motifs:write"],
  "app/(app)/plans/actions.ts#savePlanAction": ["plans:write"],
  "app/(app)/plans/actions.ts#duplicatePlanAction": ["plans:write"],
  "app/(app)/plans/actions.ts#deletePlanAction": ["plans:write"],
  "app/(app)/plans/actions.ts#recomputePlanAction": ["plans:write"],
  "app/(app)/plans/actions.ts#requestStampsAction": ["stamps:request"],
  "app/(app)/runs/actions.ts#createRunAction": ["runs:write"],
  "app/(app)/runs/actions.ts#updateStageAction": ["runs:write"],
  "app/(app)/runs/actions.ts#requestStageStampsAction": ["stamps:request"],
  "app/(app)/runs/actions.ts#updateRunAction": ["runs:write"],
  "app/(app)/runs/actions.ts#deleteRunAction": ["runs:write"],
  "app/(app)/stamps/actions.ts#createStampAction": ["stamps:write"],
  "app/(app)/stamps/actions.ts#updateStampAction": ["stamps:write"],
  "app/(app)/stamps/actions.ts#deleteStampAction": ["stamps:write"],
  "app/(app)/stamps/actions.ts#checkoutAction": ["stamps:write"],
  "app/(app)/stamps/actions.ts#returnAction": ["stamps:write"],
  "app/(app)/stamps/actions.ts#reportDamageAction": ["stamps:request"],
  "app/(app)/stamps/actions.ts#changeConditionAction": ["stamps:write"],
  "app/(app)/stamps/actions.ts#createLocationAction": ["stamps:write"],
  "app/(app)/stamps/actions.ts#locationRowAction": ["stamps:write"],
  "app/(app)/stamps/actions.ts#sendRemindersAction": ["stamps:write"],
  "app/(app)/stamps/requests/actions.ts#acceptRequestAction": ["stamps:write"],
  "app/(app)/stamps/requests/actions.ts#declineRequestAction": ["stamps:write"],
  "app/(app)/stamps/requests/actions.ts#declineNewStampAction": ["stamps:write"],
  "app/(app)/stamps/requests/actions.ts#fulfilNewStampAction": ["stamps:write"],
  "app/(app)/stamps/requests/actions.ts#requestNewStampAction": ["stamps:requestNew"],
  "app/(app)/wax/actions.ts#createRecipeAction": ["wax:write"],
  "app/(app)/wax/actions.ts#updateRecipeAction": ["wax:write"],
  "app/(app)/wax/actions.ts#duplicateRecipeAction": ["wax:write"],
  "app/(app)/wax/actions.ts#archiveRecipeAction": ["wax:write"],
  "app/(app)/wax/actions.ts#deleteRecipeAction": ["wax:write"],
  "app/(app)/wax/actions.ts#createMaterialAction": ["wax:write"],
  "app/(app)/wax/actions.ts#updateMaterialAction": ["wax:write"],
  "app/(app)/wax/actions.ts#recordMovementAction": ["wax:write"],
  // Anyone who reads may work out an estimate; saving it needs wax:write.
  "app/(app)/wax/actions.ts#estimateAction": ["data:read", "wax:write"],
  "app/(app)/wax/actions.ts#planEstimateAction": ["wax:write"],
  "app/(app)/wax/actions.ts#deleteEstimateAction": ["wax:write"],
  "app/(app)/wax/actions.ts#recordWaxUseAction": ["wax:write"],
  "app/(app)/wax/actions.ts#withdrawWaxUseAction": ["wax:write"],
  "app/(app)/wax/actions.ts#updateWaxDefaultsAction": ["wax:write"],
  // Readers get this far; recordProgress then checks the stage's own permission (waxing and boil-off:
  // runs:recordWaxing; dye and bleach: runs:write) before it writes, as the progress route does.
  "lib/actions/run-records.ts#recordProgressAction": ["data:read"],
  "lib/actions/run-records.ts#recordReadingAction": ["runs:recordWaxing"],
  "lib/actions/run-records.ts#recordFindingAction": ["runs:recordFindings"],
  "app/(auth)/forgot-password/actions.ts#forgotPasswordAction": "public",
  "app/(auth)/set-password/actions.ts#setPasswordAction": "public",
  "app/(auth)/signin/actions.ts#signInAction": "public",
  "lib/actions/choose-locale.ts#chooseLocaleAction": "public",
  "lib/actions/sign-out.ts#signOutAction": "public",
};

/** The permissions each exported action of a "use server" file asks requirePermission for. */
function checksInSource(file: string): Record<string, Permission[]> {
  const source = readFileSync(join(process.cwd(), file), "utf8");
  const parts = source.split(/^export async function (\w+)\(/m);
  const found: Record<string, Permission[]> = {};
  for (let i = 1; i < parts.length; i += 2) found[parts[i]] = [...new Set([...parts[i + 1].matchAll(/requirePermission\("([^"]+)"\)/g)].map((m) => m[1] as Permission))].sort();
  return found;
}

describe("every server action", () => {
  it("of the build is listed with the check it makes, and its source makes that check on the server", () => {
    const manifest = JSON.parse(readFileSync(join(process.cwd(), process.env.NEXT_DIST_DIR!, "server", "server-reference-manifest.json"), "utf8")) as {
      node: Record<string, { filename: string; exportedName: string }>;
    };
    const built = [...new Set(Object.values(manifest.node).map((a) => `${a.filename}#${a.exportedName}`))].sort();
    expect(built.length).toBeGreaterThan(40);
    const unlisted = built.filter((a) => !(a in actionChecks));
    expect(unlisted, "server actions without an entry in actionChecks").toEqual([]);
    const problems: string[] = [];
    for (const action of built) {
      const [file, name] = action.split("#");
      const expected = actionChecks[action];
      const inSource = checksInSource(file)[name];
      if (inSource === undefined) problems.push(`${action}: not an exported async function`);
      else if (expected === "public") {
        if (inSource.length) problems.push(`${action}: listed as public but checks ${inSource.join(", ")}`);
        if (!file.startsWith("app/(auth)/") && !["lib/actions/choose-locale.ts", "lib/actions/sign-out.ts"].includes(file)) problems.push(`${action}: only the sign-in pages, the language switch and signing out may be public`);
      } else if (inSource.join() !== [...expected].sort().join()) problems.push(`${action}: checks ${inSource.join(", ") || "nothing"}, listed ${expected.join(", ")}`);
    }
    expect(problems).toEqual([]);
  });
});
