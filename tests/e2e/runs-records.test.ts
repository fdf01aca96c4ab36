import type { Browser, Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { runUrls, type RunDto, type RunStageDto } from "@/lib/contracts/runs";
import { checkAccessibility } from "../helpers/accessibility";
import { launchBrowser, signInThroughPage } from "../helpers/browser";
import { createUser } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { expectMessageBeside } from "../helpers/forms";
import { api, signIn, type Session } from "../helpers/http";
import { seededNoisePng } from "../helpers/scan-images";
import { uniquePrefix } from "../helpers/stamps";
import { seedDemoRuns } from "../helpers/seed";

// The run page's record forms on the demo run in work ("Market cream and soga, 30 m"): a wax master records a
// waxing's day with the pot weighed before and after, a pot reading above the recipe's range (its warnings and
// the wax cautions at once) and the boil-off's wax recovered; a keeper records a quality finding. Each form also
// refuses bad input beside its field. The run is found through the API, never by a fixed id.

const RUN_NAME = "Market cream and soga, 30 m";
const prefix = uniquePrefix("RR");
let browser: Browser;
let reader: Session;
let runId: string;
let waxmaster: Awaited<ReturnType<typeof createUser>>;
let keeper: Awaited<ReturnType<typeof createUser>>;

const go = (page: Page, path: string) => page.goto(`${testEnv().appUrl}${path}`);
const getRun = async (): Promise<RunDto> => (await api("GET", `/api/v1/runs/${runId}`, { session: reader })).body.run;
const stageNo = (s: RunStageDto) => s.position + 1;
/** The first waxing not done yet, and the boil-off. */
const waxingStage = (run: RunDto) => run.stages.find((s) => s.kind === "wax" && s.state !== "done")!;
const boilOff = (run: RunDto) => run.stages.find((s) => s.kind === "boil_off")!;
/** The value beside a label in the stamp record's facts. */
const fact = (page: Page, label: string): Locator => page.getByTestId("facts").locator("dt", { hasText: new RegExp(`^${label}$`) }).locator("xpath=following-sibling::dd[1]");

async function pageAs(user: { email: string; password: string }) {
  const page = await (await browser.newContext()).newPage();
  await signInThroughPage(page, user.email, user.password);
  return page;
}

beforeAll(async () => {
  await seedDemoRuns();
  browser = await launchBrowser();
  waxmaster = await createUser("waxmaster", undefined, { name: `${prefix} wax master` });
  keeper = await createUser("keeper", undefined, { name: `${prefix} keeper` });
  const user = await createUser("planner");
  reader = (await signIn(user.email, user.password))!;
  const list = await api("GET", `/api/v1/runs?q=${encodeURIComponent(RUN_NAME)}`, { session: reader });
  runId = list.body.runs.find((r: { name: string }) => r.name === RUN_NAME).id;
  expect(runId).toBeTruthy();
});
afterAll(async () => {
  await browser?.close();
});

describe("a waxing's day on the run page", () => {
  it("refuses a pot that gained wax beside the field, then records the pot weighed before and after: the row, the stage's wax, the wax room's calibration and the stamp's impressions", async () => {
    const run = await getRun();
    const stage = waxingStage(run);
    const stamp = stage.stamps[0];
    expect(stamp).toBeDefined();
    const impressionsBefore = (await api("GET", `/api/v1/stamps/${encodeURIComponent(stamp.code)}`, { session: reader })).body.stamp.impressionsCount as number;
    const pointsOf = async () => (await api("GET", "/api/v1/wax/calibration", { session: reader })).body.recipes.find((r: { recipeId: string }) => r.recipeId === stage.recipe!.id)?.points.length ?? 0;
    const pointsBefore = await pointsOf();

    const page = await pageAs(waxmaster);
    await go(page, `/runs/${runId}`);
    const form = page.getByRole("form", { name: `Record work at stage ${stageNo(stage)} (Waxing)` });
    await form.getByLabel("Metres done").fill("6");
    await form.getByLabel("Impressions").fill("40");
    await form.getByLabel("Pot before (g)").fill("1000");
    await form.getByLabel("Pot after (g)").fill("1200");
    await form.getByRole("button", { name: "Record work" }).click();
    await expectMessageBeside(form.getByLabel("Pot after (g)"), /cannot weigh more after waxing than before/);
    expect(await form.getByLabel("Pot before (g)").inputValue()).toBe("1000");
    await checkAccessibility(page, "with the progress form showing its errors");
    expect((await getRun()).stages.find((s) => s.id === stage.id)!.progress).toHaveLength(stage.progress.length);

    const note = `${prefix} first day`;
    await form.getByLabel("Pot before (g)").fill("2400");
    await form.getByLabel("Wax added (g)").fill("300");
    await form.getByLabel("Pot after (g)").fill("1500");
    await form.getByLabel("Note").fill(note);
    await form.getByRole("button", { name: "Record work" }).click();
    await form.getByText("Work recorded.").waitFor();
    // 2,400 g + 300 g added − 1,500 g = 1,200 g used (worked by hand).
    const row = page.getByTestId("progress-row").filter({ hasText: note });
    await row.waitFor();
    expect(await row.textContent()).toMatch(/2\.4 kg \+ 300 g added → 1\.5 kg/);
    expect(await row.textContent()).toMatch(/1\.2 kg/);
    expect(await row.textContent()).toContain(`${prefix} wax master`);
    const after = (await getRun()).stages.find((s) => s.id === stage.id)!;
    expect(after.done.waxUsedG - stage.done.waxUsedG).toBeCloseTo(1200, 6);
    expect(after.state).toBe("underway");
    const workAt = page.locator(`[data-testid="stage-work"][data-stage="${stageNo(stage)}"]`);
    expect(await workAt.getByTestId("stage-wax-used").textContent()).toMatch(/^Wax used at this stage: [\d.,]+ k?g \(estimated [\d.,]+ k?g\)$/);

    // The wax room: the same record is a wax use, which the calibration fits.
    expect(await pointsOf()).toBe(pointsBefore + 1);
    await go(page, "/wax/uses");
    const use = page.getByTestId("wax-uses").locator("tr", { hasText: `${prefix} wax master` });
    await use.waitFor();
    expect(await use.textContent()).toMatch(/1,200 g/);

    // The stamp's impressions rose by the 40 made.
    await go(page, `/stamps/${encodeURIComponent(stamp.code)}`);
    expect(await fact(page, "Impressions").textContent()).toBe((impressionsBefore + 40).toLocaleString("en"));
    await page.context().close();
  });

  it("refuses a temperature that is no number beside the field; a reading above the recipe's range shows its warnings and the wax cautions at once", async () => {
    const run = await getRun();
    const stage = waxingStage(run);
    const page = await pageAs(waxmaster);
    await go(page, `/runs/${runId}`);
    const form = page.getByRole("form", { name: `Record a pot reading at stage ${stageNo(stage)} (Waxing)` });
    const workAt = page.locator(`[data-testid="stage-work"][data-stage="${stageNo(stage)}"]`);
    // Before any reading the cautions stand beside the form, compact, saying who decides.
    expect(await workAt.locator('[data-testid="wax-safety"][data-variant="compact"]').getByTestId("wax-safety-decides").textContent()).toMatch(/local fire codes, the supplier's safety data sheet and licensed practice decide/);

    const temp = form.getByLabel("Pot temperature (°C)");
    await temp.fill("hot");
    await form.getByRole("button", { name: "Record reading" }).click();
    await expectMessageBeside(temp, /Enter a number, written like 1,200\.5/);
    expect(await temp.inputValue()).toBe("hot");

    // Above the recipe's working range and above 100 °C (Rossol: wax fumes above 100 °C).
    const hot = Math.max(stage.recipe!.workingMaxC + 10, 105);
    await temp.fill(String(hot));
    await form.getByLabel("Note").fill(`${prefix} hot pot`);
    await form.getByRole("button", { name: "Record reading" }).click();
    const warnings = workAt.getByTestId("reading-warnings");
    await warnings.waitFor();
    const alert = warnings.getByRole("alert").filter({ hasText: "the pot is too hot" });
    expect(await alert.textContent()).toMatch(/above the recipe's working range/);
    expect(await alert.textContent()).toMatch(/above 100 °C: fumes rise quickly and the wax can catch fire/);
    const cautions = warnings.locator('[data-testid="wax-safety"][data-variant="alert"]');
    expect(await cautions.getAttribute("role")).toBe("alert");
    expect(await cautions.locator('[data-caution="fire"]').textContent()).toMatch(/fire blanket/);
    expect(await cautions.getByTestId("wax-safety-decides").textContent()).toMatch(/licensed practice decide/);
    // The reading stays on the stage's list with its warnings.
    const listed = workAt.getByTestId("stage-readings").locator("li[data-warns]", { hasText: `${prefix} hot pot` });
    await listed.waitFor();
    expect(await listed.textContent()).toMatch(new RegExp(`${hot} °C`));
    await checkAccessibility(page, "with a reading's cautions showing");
    await page.context().close();
  });

  it("takes the pot reading in °F from someone who works in imperial units", async () => {
    const imperial = await createUser("waxmaster", undefined, { name: `${prefix} imperial`, unitSystem: "imperial" });
    const stage = waxingStage(await getRun());
    const page = await pageAs(imperial);
    await go(page, `/runs/${runId}`);
    const form = page.getByRole("form", { name: `Record a pot reading at stage ${stageNo(stage)} (Waxing)` });
    // 230 °F = 110 °C (NIST SP 811: °C = (°F − 32) / 1.8).
    await form.getByLabel("Pot temperature (°F)").fill("230");
    await form.getByRole("button", { name: "Record reading" }).click();
    await page.getByTestId("reading-warnings").waitFor();
    const reading = (await getRun()).stages.find((s) => s.id === stage.id)!.readings.find((r) => r.recordedByName === `${prefix} imperial`)!;
    expect(reading.tempC).toBeCloseTo(110, 9);
    expect(reading.warnings).toContain("fumes");
    await page.context().close();
  });

  it("records the boil-off's wax recovered, and refuses a negative amount beside the field", async () => {
    const stage = boilOff(await getRun());
    const page = await pageAs(waxmaster);
    await go(page, `/runs/${runId}`);
    const form = page.getByRole("form", { name: `Record work at stage ${stageNo(stage)} (Boil-off)` });
    const recovered = form.getByLabel("Wax recovered (g)");
    await recovered.fill("-5");
    await form.getByRole("button", { name: "Record work" }).click();
    await expectMessageBeside(recovered, /Too small: at least 0/);
    expect(await recovered.inputValue()).toBe("-5");

    const note = `${prefix} boil-off`;
    await recovered.fill("850");
    await form.getByLabel("Note").fill(note);
    await form.getByRole("button", { name: "Record work" }).click();
    await form.getByText("Work recorded.").waitFor();
    const row = page.getByTestId("progress-row").filter({ hasText: note });
    await row.waitFor();
    expect(await row.textContent()).toMatch(/850 g/);
    const after = (await getRun()).stages.find((s) => s.id === stage.id)!;
    expect(after.done.recoveredG - stage.done.recoveredG).toBe(850);
    expect(await page.locator(`[data-testid="stage-work"][data-stage="${stageNo(stage)}"]`).getByTestId("stage-recovered").textContent()).toMatch(/Wax recovered at the boil-off/);
    await page.context().close();
  });
});

describe("a dye stage's day on the run page", () => {
  it("a planner is refused pieces that are not whole beside the field, then records the metres dyed", async () => {
    const run = await getRun();
    const stage = run.stages.find((s) => s.kind === "dye" && s.state !== "done")!;
    const planner = await createUser("planner", undefined, { name: `${prefix} planner` });
    const page = await pageAs(planner);
    await go(page, `/runs/${runId}`);
    // A planner records dyeing and bleaching, not the wax.
    expect(await page.getByRole("form", { name: /\(Waxing\)$/ }).count()).toBe(0);
    const form = page.getByRole("form", { name: `Record work at stage ${stageNo(stage)} (Dyeing)` });
    await form.getByLabel("Metres done").fill("30");
    await form.getByLabel("Pieces done").fill("2.5");
    await form.getByRole("button", { name: "Record work" }).click();
    await expectMessageBeside(form.getByLabel("Pieces done"), /Enter a whole number/);
    expect(await form.getByLabel("Metres done").inputValue()).toBe("30");

    const note = `${prefix} first dip`;
    await form.getByLabel("Pieces done").fill("");
    await form.getByLabel("Note").fill(note);
    await form.getByRole("button", { name: "Record work" }).click();
    await form.getByText("Work recorded.").waitFor();
    const row = page.getByTestId("progress-row").filter({ hasText: note });
    await row.waitFor();
    expect(await row.textContent()).toMatch(/30 m/);
    const after = (await getRun()).stages.find((s) => s.id === stage.id)!;
    expect(after.done.metres - stage.done.metres).toBe(30);
    expect(after.state).toBe("underway");
    await page.context().close();
  });
});

describe("quality findings on the run page", () => {
  it("a keeper is refused beside the field (a count of 0, an unknown stamp), then records a finding that flags its stamp", async () => {
    const run = await getRun();
    const stage = waxingStage(run);
    // The demo run already holds three "pooled" findings of one stamp this week (the flag rule: 3 within 30 days).
    const pooled = run.findings.find((f) => f.kind === "pooled" && f.stamp)!;
    expect(pooled).toBeDefined();
    const page = await pageAs(keeper);
    await go(page, `/runs/${runId}`);
    // A keeper records findings but neither waxing nor readings.
    expect(await page.getByRole("form", { name: /^Record work at stage/ }).count()).toBe(0);
    expect(await page.getByRole("form", { name: /^Record a pot reading/ }).count()).toBe(0);
    const form = page.getByRole("form", { name: "Record a quality finding" });
    await form.getByLabel("Kind").selectOption("pooled");
    await form.getByLabel("How many").fill("0");
    await form.getByLabel("Stamp code").fill("NO-SUCH-99");
    await form.getByRole("button", { name: "Record finding" }).click();
    await expectMessageBeside(form.getByLabel("How many"), /Too small: at least 1/);
    await checkAccessibility(page, "with the finding form showing its errors");
    await form.getByLabel("How many").fill("2");
    await form.getByRole("button", { name: "Record finding" }).click();
    await expectMessageBeside(form.getByLabel("Stamp code"), /There is no stamp with the code NO-SUCH-99/);
    expect(await form.getByLabel("How many").inputValue()).toBe("2");
    expect((await getRun()).findings).toHaveLength(run.findings.length);

    const where = `${prefix} piece 2, left selvedge`;
    await form.getByLabel("Stage").selectOption(stage.id);
    await form.getByLabel("Where on the cloth").fill(where);
    await form.getByLabel("Stamp code").fill(pooled.stamp!.code.toLowerCase());
    await form.getByLabel("Repair", { exact: true }).selectOption("lifted");
    await form.getByLabel("Repair note").fill("Lifted with a hot knife");
    await form.getByRole("button", { name: "Record finding" }).click();
    await form.getByText(`Stamp ${pooled.stamp!.code} is now flagged for the keepers`).waitFor();
    const row = page.getByTestId("finding-row").filter({ hasText: where });
    await row.waitFor();
    const text = await row.textContent();
    expect(text).toMatch(/Wax pooled: stamp left down too long/);
    expect(text).toMatch(new RegExp(`Stage ${stageNo(stage)}: Waxing`));
    expect(text).toMatch(/Wax lifted with a hot tool/);
    expect(text).toContain(`${prefix} keeper`);
    const link = row.getByRole("link", { name: pooled.stamp!.code });
    expect(await link.getAttribute("href")).toBe(`/stamps/${encodeURIComponent(pooled.stamp!.code)}`);
    expect((await getRun()).findings).toHaveLength(run.findings.length + 1);
    await page.context().close();
  });

  it("keeps a finding whose file is no picture, saying beside the photo field that the photo was not stored", async () => {
    const before = (await getRun()).findings.length;
    const page = await pageAs(keeper);
    await go(page, `/runs/${runId}`);
    const form = page.getByRole("form", { name: "Record a quality finding" });
    const where = `${prefix} no picture`;
    await form.getByLabel("Where on the cloth").fill(where);
    await form.getByLabel("Photo").setInputFiles({ name: "finding.jpg", mimeType: "image/jpeg", buffer: Buffer.from("these bytes are no picture at all") });
    await form.getByRole("button", { name: "Record finding" }).click();
    await expectMessageBeside(form.getByLabel("Photo"), /Upload a PNG, JPEG or WebP picture/);
    expect(await form.getByRole("status").filter({ hasText: "Finding recorded." }).textContent()).toMatch(/The photo was not stored: /);
    await page.getByTestId("finding-row").filter({ hasText: where }).waitFor();
    const run = await getRun();
    expect(run.findings).toHaveLength(before + 1);
    expect(run.findings.find((f) => f.location === where)!.photoKey).toBeNull();
    await page.context().close();
  });

  it("records a finding with its photo: the list shows the photo's thumbnail", async () => {
    const page = await pageAs(keeper);
    await go(page, `/runs/${runId}`);
    const form = page.getByRole("form", { name: "Record a quality finding" });
    const where = `${prefix} with a photo`;
    await form.getByLabel("Kind").selectOption("cracked");
    await form.getByLabel("Where on the cloth").fill(where);
    await form.getByLabel("Photo").setInputFiles({ name: "finding.png", mimeType: "image/png", buffer: await seededNoisePng(800, 600, { mean: 150, sigma: 40 }) });
    await form.getByRole("button", { name: "Record finding" }).click();
    await form.getByText("Finding recorded.").waitFor();
    const row = page.getByTestId("finding-row").filter({ hasText: where });
    const thumb = row.getByRole("img", { name: /^Photo of the finding: Unwanted cracks/ });
    await thumb.waitFor();
    await thumb.scrollIntoViewIfNeeded();
    await expect.poll(() => thumb.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0)).toBe(true);
    const finding = (await getRun()).findings.find((f) => f.location === where)!;
    expect(finding.photoKey).toBeTruthy();
    expect(await thumb.getAttribute("src")).toBe(runUrls.findingPhoto(runId, finding.id, "thumb"));
    await page.context().close();
  });
});
