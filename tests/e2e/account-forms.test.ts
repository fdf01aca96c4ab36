import { randomBytes } from "node:crypto";
import type { Browser, ConsoleMessage } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { userTokens } from "@/db/schema";
import { hashSecret } from "@/lib/auth/secrets";
import { createUser, db, reloadUser } from "../helpers/db";
import { launchBrowser, signInThroughPage } from "../helpers/browser";
import { testEnv } from "../helpers/env";
import { expectMessageBeside } from "../helpers/forms";
import { api } from "../helpers/http";
import { latestMailTo, linkIn } from "../helpers/mail";

// The account page's forms and the sign-in, forgot-password and set-password forms: valid input and its
// result, invalid input and the message beside the field.

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("my account", () => {
  it("the profile refuses an empty name beside the field and saves a real one", async () => {
    const { appUrl } = testEnv();
    const user = await createUser("planner");
    const page = await (await browser.newContext()).newPage();
    await signInThroughPage(page, user.email, user.password);
    await page.goto(`${appUrl}/account`);
    const name = page.getByLabel("Name");
    await name.fill("   ");
    await page.getByRole("button", { name: "Save", exact: true }).click();
    await expectMessageBeside(name, /Required/);
    await name.fill("Ayu Larasati");
    await page.getByLabel("Units").selectOption("imperial");
    await page.getByRole("button", { name: "Save", exact: true }).click();
    await page.getByText("Saved.").waitFor();
    expect(await reloadUser(user.id)).toMatchObject({ name: "Ayu Larasati", unitSystem: "imperial" });
    await page.context().close();
  });

  it("a token needs a name beside the field; a named one is shown once, listed, and its last use shows without a time-zone warning", async () => {
    const { appUrl } = testEnv();
    const user = await createUser("keeper");
    const context = await browser.newContext();
    const page = await context.newPage();
    const problems: string[] = [];
    page.on("console", (message: ConsoleMessage) => {
      if (message.type() === "error" || message.type() === "warning") problems.push(message.text());
    });
    await signInThroughPage(page, user.email, user.password);
    await page.goto(`${appUrl}/account`);
    const name = page.getByLabel("What is it for?");
    await page.getByRole("button", { name: "Create token" }).click();
    await expectMessageBeside(name, /Required/);

    await name.fill("Nightly export");
    await page.getByRole("button", { name: "Create token" }).click();
    const secret = (await page.getByTestId("new-token").textContent())!;
    expect(secret).toMatch(/^cg_/);
    expect((await api("GET", "/api/v1/me", { token: secret })).status).toBe(200);

    await page.reload();
    await page.getByText("Nightly export").waitFor();
    await page.getByText("Last used", { exact: false }).waitFor();
    expect(await page.getByText("never").count()).toBe(0);
    await page.waitForTimeout(500);
    expect(problems.filter((p) => /ENVIRONMENT_FALLBACK|timeZone|`now`/.test(p))).toEqual([]);
    await context.close();
  });
});

describe("signing in and passwords", () => {
  it("sign-in names a malformed address beside the field; good credentials sign in", async () => {
    const { appUrl } = testEnv();
    const user = await createUser("designer");
    const page = await (await browser.newContext()).newPage();
    await page.goto(`${appUrl}/signin`);
    await page.getByLabel("E-mail").fill("designer-at-workshop");
    await page.getByLabel("Password").fill("whatever it is");
    await page.getByRole("button", { name: "Sign in" }).click();
    await expectMessageBeside(page.getByLabel("E-mail"), /e-mail address like name@example\.com/);
    await page.getByLabel("E-mail").fill(user.email);
    await page.getByLabel("Password").fill(user.password);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(`${appUrl}/`);
    await page.context().close();
  });

  it("a reset link: the forgot form names a bad address beside it; the new password is checked beside its fields; a used link says so before any form", async () => {
    const { appUrl } = testEnv();
    const user = await createUser("waxmaster");
    const page = await (await browser.newContext()).newPage();
    await page.goto(`${appUrl}/forgot-password`);
    await page.getByLabel("E-mail").fill("nobody@");
    await page.getByRole("button", { name: "Send the link" }).click();
    await expectMessageBeside(page.getByLabel("E-mail"), /e-mail address/);
    await page.getByLabel("E-mail").fill(user.email);
    await page.getByRole("button", { name: "Send the link" }).click();
    await page.getByText("If that address belongs to an active account, a link is on its way.").waitFor();

    const mail = await latestMailTo(user.email, /reset/i);
    expect(mail.text).toMatch(/until .+ \(Asia\/Jakarta\)/);
    const link = linkIn(mail);
    await page.goto(link);
    await page.getByLabel("New password").fill("short");
    await page.getByLabel("Type it again").fill("short");
    await page.getByRole("button", { name: "Set password" }).click();
    await expectMessageBeside(page.getByLabel("New password"), /at least 10 characters/);
    await page.getByLabel("New password").fill("indigo and soga 42");
    await page.getByLabel("Type it again").fill("indigo and soga 24");
    await page.getByRole("button", { name: "Set password" }).click();
    await expectMessageBeside(page.getByLabel("Type it again"), /The two passwords differ/);
    await page.getByLabel("New password").fill("indigo and soga 42");
    await page.getByLabel("Type it again").fill("indigo and soga 42");
    await page.getByRole("button", { name: "Set password" }).click();
    await page.waitForURL(/\/signin\?notice=password-set/);

    await page.goto(link);
    await page.getByText("This link was used already").waitFor();
    expect(await page.getByLabel("New password").count()).toBe(0);
    await page.context().close();
  });

  it("an expired link says so before any form", async () => {
    const { appUrl } = testEnv();
    const user = await createUser("planner");
    const secret = randomBytes(32).toString("base64url");
    await db().insert(userTokens).values({ userId: user.id, kind: "reset", tokenHash: hashSecret(secret), expiresAt: new Date(Date.now() - 60_000) });
    const page = await (await browser.newContext()).newPage();
    await page.goto(`${appUrl}/set-password?token=${encodeURIComponent(secret)}`);
    await page.getByText("This link has expired.").waitFor();
    expect(await page.getByLabel("New password").count()).toBe(0);
    await page.context().close();
  });
});
