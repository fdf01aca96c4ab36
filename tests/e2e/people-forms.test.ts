import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { workshopSettingChanges, workshopSettings } from "@/db/schema";
import { createUser, db, reloadUser } from "../helpers/db";
import { launchBrowser, signInThroughPage } from "../helpers/browser";
import { testEnv } from "../helpers/env";
import { expectMessageBeside, messageBeside } from "../helpers/forms";
import { api, signIn } from "../helpers/http";
import { latestMailTo } from "../helpers/mail";

// The forms of the People area (invite, role, disable, links, tokens) and the workshop settings, each with valid
// input and with input it refuses beside the field.

let browser: Browser;
let page: Page;
let admin: Awaited<ReturnType<typeof createUser>>;
// Errors in the browser, hydration mismatches among them (which can drop a click while React redraws the page).
const pageErrors: string[] = [];

beforeAll(async () => {
  browser = await launchBrowser();
  admin = await createUser("admin");
  page = await (await browser.newContext()).newPage();
  page.on("pageerror", (error) => pageErrors.push(error.message));
  await signInThroughPage(page, admin.email, admin.password);
});
afterAll(async () => {
  await browser?.close();
});

describe("the admin pages", () => {
  it("render in the browser without errors, also with many people and tokens, some just used", async () => {
    const keeper = await createUser("keeper");
    const session = (await signIn(keeper.email, keeper.password))!;
    const { body } = await api("POST", "/api/v1/tokens", { session, body: { name: "Used a moment ago" } });
    await api("GET", "/api/v1/me", { token: body.token.secret });
    await go("/admin");
    await page.getByTestId(`token-row-${body.token.id}`).waitFor();
    await page.waitForTimeout(1500);
    expect(pageErrors).toEqual([]);
  });
});

const go = (path: string) => page.goto(`${testEnv().appUrl}${path}`);
const rowOf = (email: string) => page.getByTestId(`user-row-${email}`);

describe("inviting", () => {
  it("names an e-mail address that is taken once, beside the field", async () => {
    const taken = await createUser("designer");
    await go("/admin");
    const invite = page.getByRole("form", { name: "Invite someone" });
    await invite.getByLabel("Name").fill("Second Designer");
    await invite.getByLabel("E-mail").fill(taken.email);
    await invite.getByRole("button", { name: "Send invitation", exact: true }).click();
    await expectMessageBeside(invite.getByLabel("E-mail"), /^Someone already has this e-mail address\.$/);
    // The form's own notice only points at the fields: the same fact is not said twice.
    expect(await invite.getByRole("alert").textContent()).toBe("Some fields need attention; see the messages beside them.");
  });
});

describe("roles and access", () => {
  it("asks before a role change: Cancel keeps the role, confirming saves it", async () => {
    const keeper = await createUser("keeper");
    await go("/admin");
    const role = rowOf(keeper.email).getByRole("combobox");
    await role.selectOption("planner");
    const dialog = page.getByRole("dialog", { name: "Change the role of Test keeper?" });
    await dialog.waitFor();
    expect(await dialog.textContent()).toContain("goes from Stamp keeper to Layout planner");
    await dialog.getByRole("button", { name: "Cancel" }).click();
    await expect.poll(() => role.inputValue()).toBe("keeper");
    expect((await reloadUser(keeper.id)).role).toBe("keeper");

    await role.selectOption("planner");
    await dialog.getByRole("button", { name: "Make them Layout planner" }).click();
    await page.getByText("Saved.").waitFor();
    await expect.poll(async () => (await reloadUser(keeper.id)).role).toBe("planner");
  });

  it("asks before disabling someone", async () => {
    const designer = await createUser("designer");
    await go("/admin");
    await rowOf(designer.email).getByRole("button", { name: "Disable" }).click();
    const dialog = page.getByRole("dialog", { name: "Disable Test designer?" });
    await dialog.getByRole("button", { name: "Disable" }).click();
    await expect.poll(() => rowOf(designer.email).textContent()).toContain("Disabled");
    expect((await reloadUser(designer.id)).disabled).toBe(true);
  });

  it("a role that does not exist is refused beside the role; one's own role is not offered for change", async () => {
    const designer = await createUser("designer");
    await go("/admin");
    const own = rowOf(admin.email).getByRole("combobox");
    expect(await own.isDisabled()).toBe(true);
    expect(await messageBeside(own)).toBe("");
    expect(await rowOf(admin.email).textContent()).toContain("Another administrator can change your role.");

    // A tampered form (the server checks what the page offers).
    const role = rowOf(designer.email).getByRole("combobox");
    const dialog = page.getByRole("dialog", { name: "Change the role of Test designer?" });
    // The row's change handler exists once the page is hydrated, which on a busy machine can come after the first
    // choice (and hydration may drop an option added before it): add the option and choose it until the dialog asks.
    await expect
      .poll(async () => {
        await role.evaluate((select: HTMLSelectElement) => {
          if (![...select.options].some((o) => o.value === "boss")) select.add(new Option("Master of all", "boss"));
        });
        await role.selectOption("designer");
        await role.selectOption("boss");
        return dialog.isVisible();
      })
      .toBe(true);
    await dialog.getByRole("button", { name: /^Make them/ }).click();
    await expectMessageBeside(rowOf(designer.email).getByRole("combobox"), /Choose one of: admin, keeper/);
    expect((await reloadUser(designer.id)).role).toBe("designer");
  });

  it("sends a reset link and resends an invitation", async () => {
    const planner = await createUser("planner");
    await go("/admin");
    await rowOf(planner.email).getByRole("button", { name: "Send reset link" }).click();
    await page.getByText(`A reset link was sent to ${planner.email}.`).waitFor();
    expect((await latestMailTo(planner.email, /reset/i)).subject).toBe("Reset your Capgrid password");
  });
});

describe("everyone's API tokens", () => {
  it("lists a keeper's token with its owner and revokes it: the token stops working", async () => {
    const keeper = await createUser("keeper");
    const session = (await signIn(keeper.email, keeper.password))!;
    const created = await api("POST", "/api/v1/tokens", { session, body: { name: "Shelf export script" } });
    const { id, secret } = created.body.token;
    expect((await api("GET", "/api/v1/stamps?pageSize=1", { token: secret })).status).toBe(200);

    await go("/admin");
    const row = page.getByTestId(`token-row-${id}`);
    expect(await row.textContent()).toContain("Shelf export script");
    expect(await row.textContent()).toContain(keeper.email);
    page.once("dialog", (dialog) => void dialog.accept());
    await row.getByRole("button", { name: "Revoke" }).click();
    await page.getByText(`The token "Shelf export script" of Test keeper was revoked.`).waitFor();
    expect((await api("GET", "/api/v1/stamps?pageSize=1", { token: secret })).status).toBe(401);
  });
});

describe("workshop settings", () => {
  const restore = async () => {
    const [row] = await db().select().from(workshopSettings);
    if (row && row.values.timeZone !== "Asia/Jakarta") await db().update(workshopSettings).set({ values: { ...row.values, timeZone: "Asia/Jakarta" } });
  };
  afterAll(restore);

  it("refuses a time zone that does not exist beside the field; saves a real one, keeps it in the history and shows dates in it", async () => {
    await go("/admin/settings");
    const form = page.getByRole("form", { name: "Workshop settings" });
    const zone = form.getByLabel("Time zone");
    expect(await zone.inputValue()).toBe("Asia/Jakarta");
    await zone.fill("Mars/Olympus_Mons");
    await form.getByRole("button", { name: "Save settings" }).click();
    await expectMessageBeside(zone, /Choose a time zone by its name/);

    await zone.fill("America/Sao_Paulo");
    expect(await page.getByTestId("time-zone-preview").textContent()).toMatch(/^It is now .+ there\.$/);
    await form.getByRole("button", { name: "Save settings" }).click();
    await page.getByText("Saved. Dates and times now show in America/Sao_Paulo.").waitFor();

    await go("/admin/settings");
    const [latest] = await db().select().from(workshopSettingChanges).orderBy(workshopSettingChanges.version).then((rows) => rows.slice(-1));
    expect(latest.changes).toEqual([{ key: "timeZone", from: "Asia/Jakarta", to: "America/Sao_Paulo" }]);
    expect(latest.actorName).toBe(admin.name);
    // The history's own time, in the new zone (Intl, the platform's formatter, as the reference).
    const expected = new Intl.DateTimeFormat("en", { dateStyle: "medium", timeStyle: "short", timeZone: "America/Sao_Paulo" }).format(latest.at);
    const first = page.getByTestId("settings-history").locator("li").first();
    expect(await first.textContent()).toContain(expected);
    expect(await first.textContent()).toContain("Time zone: Asia/Jakarta → America/Sao_Paulo");

    // Back to the default, through the same form.
    await page.getByLabel("Time zone").fill("Asia/Jakarta");
    await page.getByRole("button", { name: "Save settings" }).click();
    await page.getByText("Saved. Dates and times now show in Asia/Jakarta.").waitFor();
  });

  it("is not for other roles", async () => {
    const keeper = await createUser("keeper");
    const context = await browser.newContext();
    const other = await context.newPage();
    await signInThroughPage(other, keeper.email, keeper.password);
    await other.goto(`${testEnv().appUrl}/admin/settings`);
    await other.getByText("Not for your role").waitFor();
    await context.close();
  });
});
