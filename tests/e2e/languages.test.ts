import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { translator } from "@/lib/i18n/translator";
import { createUser, reloadUser } from "../helpers/db";
import { launchBrowser, signInThroughPage } from "../helpers/browser";
import { testEnv } from "../helpers/env";
import { expectMessageBeside } from "../helpers/forms";
import { api, signIn } from "../helpers/http";
import { englishLeftOn, textsOn } from "../helpers/languages";
import { latestMailTo } from "../helpers/mail";
import { createStampRow, reloadStamp, uniquePrefix } from "../helpers/stamps";

// A keeper works the shelf in Bahasa Indonesia from start to end; the mail their report sends reaches each
// other keeper in that keeper's own language; and someone who works in English sees nothing change.

const id = translator("id");
const en = translator("en");
const prefix = uniquePrefix("BHS");
let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function signedIn(user: { email: string; password: string }): Promise<Page> {
  const page = await (await browser.newContext({ locale: "en-US" })).newPage();
  await signInThroughPage(page, user.email, user.password);
  return page;
}

const lang = (page: Page) => page.evaluate(() => document.documentElement.lang);

describe("a keeper who switches to Bahasa Indonesia", () => {
  it("checks a stamp out, takes it back and reports damage with every label, message and error in Indonesian; the other keepers are mailed in their own language", async () => {
    const { appUrl } = testEnv();
    const code = `${prefix}-1`;
    await createStampRow({ code, name: "Kawung picis" });
    const keeper = await createUser("keeper");
    const englishKeeper = await createUser("keeper", undefined, { locale: "en", localeSource: "person" });
    const indonesianKeeper = await createUser("keeper", undefined, { locale: "id", localeSource: "person" });
    const page = await signedIn(keeper);
    expect(await lang(page)).toBe("en");

    // The switch in the header: a form with a button per language, each named in itself.
    const switcher = page.getByRole("form", { name: en("language.label") });
    await switcher.getByRole("button", { name: "Bahasa Indonesia" }).focus();
    await page.keyboard.press("Enter");
    await expect.poll(() => lang(page)).toBe("id");
    expect(await page.getByRole("form", { name: "Bahasa" }).getByRole("button", { name: "Bahasa Indonesia" }).getAttribute("aria-pressed")).toBe("true");
    expect((await reloadUser(keeper.id)).locale).toBe("id");
    // The page title follows too ("Ringkasan · Capgrid").
    await expect.poll(() => page.title()).toBe(`${id("home.title")} · ${id("app.name")}`);
    expect(await englishLeftOn(page)).toEqual([]);

    await page.goto(`${appUrl}/stamps`);
    await expect.poll(() => page.title()).toBe(`${id("stamps.title")} · ${id("app.name")}`);
    expect(await lang(page)).toBe("id");

    await page.goto(`${appUrl}/stamps/${code}`);
    await page.getByRole("heading", { name: new RegExp(code) }).waitFor();
    expect(await englishLeftOn(page)).toEqual([]);

    // Check-out: the missing workstation is named beside its field, in Indonesian; what was typed stays.
    const out = page.getByRole("form", { name: id("stamps.checkout.title") });
    await out.getByLabel(id("stamps.checkout.borrower")).selectOption("other");
    await out.getByLabel(id("stamps.checkout.name"), { exact: true }).fill("Ratri Handayani");
    await out.getByRole("button", { name: id("stamps.checkout.submit"), exact: true }).click();
    await expectMessageBeside(out.getByLabel(id("stamps.checkout.workstation")), new RegExp(id("validation.required").replace(".", "\\.")));
    await page.getByText(id("common.formHasErrors")).waitFor();
    expect(await englishLeftOn(page)).toEqual([]);
    expect(await out.getByLabel(id("stamps.checkout.name"), { exact: true }).inputValue()).toBe("Ratri Handayani");
    await out.getByLabel(id("stamps.checkout.workstation")).fill("Meja cap 9");
    await out.getByRole("button", { name: id("stamps.checkout.submit"), exact: true }).click();
    await page.getByText(/^Dipinjamkan: cap sekarang dibawa Ratri Handayani ke Meja cap 9, kembali paling lambat/).waitFor();
    expect(await englishLeftOn(page)).toEqual([]);

    // Return: "120.5" is no number in Indonesian, and the message shows how one is written; "1.200" is twelve hundred.
    const back = page.getByRole("form", { name: id("stamps.return.title") });
    const impressions = back.getByLabel(id("stamps.return.impressions"));
    await impressions.fill("120.5");
    await back.getByRole("button", { name: id("stamps.return.submit") }).click();
    await expectMessageBeside(impressions, /^Masukkan angka, ditulis seperti 1\.200,5\.$/);
    expect(await englishLeftOn(page)).toEqual([]);
    await impressions.fill("1.200");
    await back.getByRole("button", { name: id("stamps.return.submit") }).click();
    await page.getByText(id("stamps.record.saved.returned")).waitFor();
    expect((await reloadStamp(code))!.impressionsCount).toBe(1200);
    // The count in the facts, in Indonesian figures.
    await expect.poll(() => page.getByTestId("facts").textContent()).toContain("1.200");
    expect(await englishLeftOn(page)).toEqual([]);

    // Damage: "Lainnya" needs details, said beside the field.
    await page.getByText(id("stamps.damage.title"), { exact: true }).first().click();
    const damage = page.getByRole("form", { name: id("stamps.damage.title") });
    await damage.getByLabel(id("stamps.damage.kind")).selectOption({ label: id("stamps.damageKinds.other") });
    await damage.getByRole("button", { name: id("stamps.damage.submit") }).click();
    await expectMessageBeside(damage.getByLabel(id("stamps.damage.note")), new RegExp(id("validation.required").replace(".", "\\.")));
    expect(await englishLeftOn(page)).toEqual([]);
    await damage.getByLabel(id("stamps.damage.kind")).selectOption({ label: id("stamps.damageKinds.bent_strip") });
    await damage.getByLabel(id("stamps.damage.note")).fill("Lempeng kiri atas bengkok ke dalam");
    await damage.getByRole("button", { name: id("stamps.damage.submit") }).click();
    await page.getByTestId("open-damage").waitFor();
    expect(await page.getByTestId("open-damage").textContent()).toContain(id("stamps.damageKinds.bent_strip"));
    expect(await englishLeftOn(page)).toEqual([]);
    const history = await page.getByTestId("history").textContent();
    expect(history).toContain("Ratri Handayani");
    expect(history).toContain(id("stamps.damageKinds.bent_strip"));

    // The other keepers hear of it, each in their own language, not in the reporter's.
    const toEnglish = await latestMailTo(englishKeeper.email, new RegExp(code));
    expect(toEnglish.subject).toBe(en("stampEmails.damage.subject", { code }));
    expect(toEnglish.text).toContain(en("stampEmails.damage.greeting"));
    expect(toEnglish.text).toContain(en("stampEmails.damage.action"));
    expect(toEnglish.text).toContain(en("stamps.damageKinds.bent_strip"));
    expect(toEnglish.headers?.["content-language"]).toBe("en");
    const toIndonesian = await latestMailTo(indonesianKeeper.email, new RegExp(code));
    expect(toIndonesian.subject).toBe(id("stampEmails.damage.subject", { code }));
    expect(toIndonesian.text).toContain(id("stampEmails.damage.greeting"));
    expect(toIndonesian.text).toContain(id("stampEmails.damage.action"));
    expect(toIndonesian.text).toContain(id("stamps.damageKinds.bent_strip"));
    expect(toIndonesian.text).not.toContain(en("stampEmails.damage.greeting"));
    expect(toIndonesian.headers?.["content-language"]).toBe("id");

    // The choice is the keeper's, on every device: a new browser opens in Indonesian after signing in.
    const elsewhere = await signedIn(keeper);
    expect(await lang(elsewhere)).toBe("id");
    expect(await englishLeftOn(elsewhere)).toEqual([]);
    // An address nobody knows answers in Indonesian too, title included.
    expect((await elsewhere.goto(`${appUrl}/tidak-ada-di-sini`))?.status()).toBe(404);
    await expect.poll(() => elsewhere.title()).toBe(`${id("common.notFoundTitle")} · ${id("app.name")}`);
    expect(await englishLeftOn(elsewhere)).toEqual([]);
    await elsewhere.context().close();
    await page.context().close();
  });
});

describe("someone who works in English", () => {
  it("sees the same screens as before while a colleague works in Indonesian", async () => {
    const { appUrl } = testEnv();
    const code = `${prefix}-2`;
    await createStampRow({ code, impressionsCount: 1200 });
    const colleague = await signedIn(await createUser("keeper", undefined, { locale: "id", localeSource: "person" }));
    expect(await lang(colleague)).toBe("id");

    const page = await signedIn(await createUser("keeper"));
    await expect.poll(() => page.title()).toBe("Overview · Capgrid");
    await page.goto(`${appUrl}/stamps/${code}`);
    expect(await lang(page)).toBe("en");
    await page.getByRole("form", { name: "Check out" }).waitFor();
    // Nothing Indonesian on the English page; and the same check finds English here, so it is no empty check.
    expect(await textsOn(page, "id")).toEqual([]);
    expect(await englishLeftOn(page)).toEqual(expect.arrayContaining(["Check out", "Report damage"]));
    expect(await page.getByTestId("facts").textContent()).toContain("1,200");
    expect(await page.getByRole("form", { name: "Language" }).getByRole("button", { name: "English" }).getAttribute("aria-pressed")).toBe("true");
    const out = page.getByRole("form", { name: "Check out" });
    await out.getByLabel("Who takes it").selectOption("other");
    await out.getByRole("button", { name: "Check out", exact: true }).click();
    await expectMessageBeside(out.getByLabel("Workstation"), /^Required\.$/);
    expect(await textsOn(page, "id")).toEqual([]);
    await colleague.context().close();
    await page.context().close();
  });
});

describe("a planner who works in Bahasa Indonesia", () => {
  it("prints a plan's stamping sheet in Indonesian, with Indonesian number writing and no English left", async () => {
    const { appUrl } = testEnv();
    const code = `${prefix}-S`;
    await createStampRow({ code, name: `Kawung ${prefix}`, widthMm: 200, heightMm: 300 });
    const planner = await createUser("planner", undefined, { locale: "id", localeSource: "person" });
    const session = (await signIn(planner.email, planner.password))!;
    // 1150 mm mori, 25 mm margins, a 200 × 300 mm stamp straight over 60 m. Worked by hand: ⌊1100 / 200⌋ = 5 across,
    // 1000 / 300 = 3.33 rows a metre → 16.67 impressions a metre; 60 000 / 300 = 200 rows → 1000 for the run;
    // at the default 26 impressions an hour, 1000 / 26 = 38.5 h.
    const saved = await api("POST", "/api/v1/plans", {
      session,
      body: { name: `${prefix} lembar`, layout: { cloth: { widthMm: 1150, lengthMm: 60_000, margins: { leftMm: 25, rightMm: 25 } }, stamp: { code }, gap: { xMm: 0, yMm: 0 }, arrangement: "straight" } },
    });
    expect(saved.status, JSON.stringify(saved.body)).toBe(201);
    expect(saved.body.plan.summary.impressionsTotal).toBe(1000);

    const page = await signedIn(planner);
    await page.goto(`${appUrl}/plans/${saved.body.plan.id}/sheet`);
    await page.getByTestId("stamping-sheet").waitFor();
    expect(await lang(page)).toBe("id");
    await page.emulateMedia({ media: "print" });
    await expect.poll(() => page.title()).toBe(`${id("plans.sheet.title")} · Capgrid`);
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe(id("plans.sheet.heading", { name: `${prefix} lembar` }));
    expect(await englishLeftOn(page)).toEqual([]);

    const counts = (await page.getByTestId("sheet-counts").textContent()) ?? "";
    expect(counts).toContain(id("plans.sheet.perRun"));
    expect(counts).toContain("1.000"); // impressions for the run, a dot between thousands
    expect(counts).toContain("16,67"); // impressions per metre, a decimal comma
    expect(counts).toContain("38,5 jam"); // stamping time
    expect(counts).not.toMatch(/1,000|16\.67|38\.5/);
    const header = (await page.locator("header").filter({ hasText: id("plans.sheet.heading", { name: `${prefix} lembar` }) }).textContent()) ?? "";
    expect(header).not.toMatch(/1,150/);
    expect(await page.getByTestId("sheet-stamps").textContent()).toContain(id("plans.sheet.noLocation"));
    // The same check finds the English sheet's texts, so it is no empty check.
    const english = await signedIn(await createUser("planner"));
    await english.goto(`${appUrl}/plans/${saved.body.plan.id}/sheet`);
    await english.getByTestId("stamping-sheet").waitFor();
    expect(await englishLeftOn(english)).toEqual(expect.arrayContaining([en("plans.sheet.perRun"), en("plans.sheet.countsTitle")]));
    expect(await english.getByTestId("sheet-counts").textContent()).toContain("1,000");
    await english.context().close();
    await page.context().close();
  });
});

describe("the sign-in pages", () => {
  it("switch language before anyone signs in, and the first sign-in keeps it", async () => {
    const { appUrl } = testEnv();
    const user = await createUser("planner");
    const page = await (await browser.newContext({ locale: "en-US" })).newPage();
    await page.goto(`${appUrl}/signin`);
    expect(await lang(page)).toBe("en");
    await page.getByRole("form", { name: "Language" }).getByRole("button", { name: "Bahasa Indonesia" }).click();
    await expect.poll(() => lang(page)).toBe("id");
    expect(await englishLeftOn(page)).toEqual([]);
    await page.getByLabel(id("signin.email")).fill(user.email);
    await page.getByLabel(id("signin.password")).fill(user.password);
    await page.getByRole("button", { name: id("signin.submit") }).click();
    await page.waitForURL(`${appUrl}/`);
    expect(await lang(page)).toBe("id");
    expect(await reloadUser(user.id)).toMatchObject({ locale: "id", localeSource: "browser" });
    await page.context().close();
  });
});
