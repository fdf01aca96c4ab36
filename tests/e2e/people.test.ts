import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createUser, uniqueEmail } from "../helpers/db";
import { launchBrowser, navLabels, signInThroughPage } from "../helpers/browser";
import { testEnv } from "../helpers/env";
import { latestMailTo, linkIn } from "../helpers/mail";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("an administrator", () => {
  it("invites a keeper, who sets a password from the e-mail and sees the navigation of their role", async () => {
    const { appUrl } = testEnv();
    const admin = await createUser("admin");
    const adminContext = await browser.newContext();
    const page = await adminContext.newPage();
    await signInThroughPage(page, admin.email, admin.password);
    expect(await navLabels(page)).toEqual(["Overview", "Stamp shelf", "Cloth plans", "Wax room", "Motif archive", "Production runs", "People"]);

    await page.getByRole("link", { name: "People" }).click();
    await page.waitForURL(`${appUrl}/admin`);
    const email = uniqueEmail("new-keeper");
    const invite = page.getByRole("form", { name: "Invite someone" });
    // A bad address first: the form says what is wrong and keeps the typed name.
    await invite.getByLabel("Name").fill("Wening Kusumastuti");
    await invite.getByLabel("E-mail").fill("wening-at-example");
    await invite.getByRole("button", { name: "Send invitation", exact: true }).click();
    await expect.poll(() => invite.locator("#invite-email-error").textContent()).toMatch(/e-mail address/i);
    expect(await invite.getByLabel("Name").inputValue()).toBe("Wening Kusumastuti");

    await invite.getByLabel("E-mail").fill(email);
    await invite.getByLabel("Role").selectOption("keeper");
    await invite.getByRole("button", { name: "Send invitation", exact: true }).click();
    await page.getByText(`An invitation was sent to ${email}.`).waitFor();
    const row = page.getByTestId(`user-row-${email}`);
    await expect.poll(() => row.textContent()).toContain("Invited");
    await adminContext.close();

    const mail = await latestMailTo(email, /invited/i);
    expect(mail.subject).toBe("You are invited to Capgrid");
    const link = linkIn(mail);
    expect(link.startsWith(`${appUrl}/set-password?token=`)).toBe(true);

    const newcomer = await browser.newContext();
    const page2 = await newcomer.newPage();
    await page2.goto(link);
    await page2.getByLabel("New password").fill("wax and indigo 42");
    await page2.getByLabel("Type it again").fill("wax and indigo 42");
    await page2.getByRole("button", { name: "Set password" }).click();
    await page2.waitForURL(/\/signin\?notice=password-set/);
    await page2.getByText("Your password is set.").waitFor();

    await signInThroughPage(page2, email, "wax and indigo 42");
    expect(await navLabels(page2)).toEqual(["Overview", "Stamp shelf", "Cloth plans", "Wax room", "Motif archive", "Production runs"]);
    await page2.getByText("Stamp keeper", { exact: false }).first().waitFor();
    expect(await page2.getByTestId("permissions").textContent()).toContain("check stamps out");

    // The admin area is not theirs: no link, and the page itself refuses.
    await page2.goto(`${appUrl}/admin`);
    await page2.getByText("Not for your role").waitFor();

    // The link worked once: opening it again says so at once, with no form to fill in.
    await page2.goto(link);
    await page2.getByText(/This link was used already/).waitFor();
    expect(await page2.getByLabel("New password").count()).toBe(0);
    await newcomer.close();
  });
});

describe("each role", () => {
  it.each([
    ["admin", ["Overview", "Stamp shelf", "Cloth plans", "Wax room", "Motif archive", "Production runs", "People"]],
    ["keeper", ["Overview", "Stamp shelf", "Cloth plans", "Wax room", "Motif archive", "Production runs"]],
    ["planner", ["Overview", "Stamp shelf", "Cloth plans", "Wax room", "Motif archive", "Production runs"]],
    ["waxmaster", ["Overview", "Stamp shelf", "Cloth plans", "Wax room", "Motif archive", "Production runs"]],
    ["designer", ["Overview", "Stamp shelf", "Cloth plans", "Wax room", "Motif archive", "Production runs"]],
  ] as const)("%s sees the navigation its role allows", async (role, expected) => {
    const user = await createUser(role);
    const context = await browser.newContext();
    const page = await context.newPage();
    await signInThroughPage(page, user.email, user.password);
    expect(await navLabels(page)).toEqual(expected);
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(/\/signin/);
    await context.close();
  });

  it("a wrong password gets a clear message and keeps the e-mail", async () => {
    const { appUrl } = testEnv();
    const user = await createUser("planner");
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto(`${appUrl}/signin`);
    await page.getByLabel("E-mail").fill(user.email);
    await page.getByLabel("Password").fill("not the password");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByText("do not match an active account").waitFor();
    expect(await page.getByLabel("E-mail").inputValue()).toBe(user.email);
    await context.close();
  });
});
