import { test } from "@playwright/test";
import path from "node:path";
import { SHOTS, SignInPage, expect, shot } from "./pages";

test("presenter plans a build, a step fails, a remedy follows, and the timeline shows the waits", async ({ page }) => {
  await new SignInPage(page).signIn("presenter@jigboard.example");
  const channelId = page.url().split("/c/")[1]!;
  const created = await page.request.post(`/api/channels/${channelId}/episodes`, { data: { title: `Hall table ${Date.now().toString(36)}`, stage: "planning" } });
  expect(created.status()).toBe(201);
  const { episode } = (await created.json()) as { episode: { id: string } };
  await page.goto(`/c/${channelId}/episodes/${episode.id}/plan`);
  await expect(page.getByTestId("plan-empty")).toBeVisible();

  const form = page.getByRole("form", { name: "Add step" });
  const add = async (title: string, active: string, wait: string, unit: string, reason: string, dependsOn: string[] = [], hazards: string[] = []) => {
    await form.getByLabel("Step title").fill(title);
    await form.getByLabel("Hands-on minutes").fill(active);
    await form.getByLabel("Wait after").fill(wait);
    await form.getByLabel("Wait unit").selectOption(unit);
    await form.getByLabel("Why the wait (glue cure, finish dry, acclimatise…)").fill(reason);
    for (const d of dependsOn) await form.getByRole("checkbox", { name: new RegExp(`\\d+\\. ${d}$`) }).check();
    for (const h of hazards) await form.getByRole("checkbox", { name: h }).check();
    await form.getByRole("button", { name: "Add step" }).click();
    await expect(page.locator(`[data-step-title="${title}"]`)).toBeVisible();
  };

  // Field-level refusal first.
  await form.getByLabel("Hands-on minutes").fill("-3");
  await form.getByRole("button", { name: "Add step" }).click();
  await expect(form.getByText("give the step a title")).toBeVisible();
  await expect(form.getByText("cannot be negative")).toBeVisible();

  await add("Mill the stock", "60", "0", "minutes", "");
  await add("Glue up the top", "30", "1", "days", "glue cure", ["Mill the stock"]);
  await add("Oil finish", "20", "2", "days", "finish dries", ["Glue up the top"], ["Finishes and solvents"]);

  // 60 + 30 + 1 day + 20 + 2 days = 3d 1h 50m along one chain.
  await expect(page.getByTestId("plan-totals")).toContainText("3d 1h 50m");
  await expect(page.locator('[data-step-title="Oil finish"]').getByTestId("caution-finish")).toContainText("CAUTION");
  await expect(page.locator('[data-step-title="Oil finish"]').getByTestId("caution-finish")).toContainText("manufacturer's instructions");

  const glue = page.locator('[data-step-title="Glue up the top"]');
  await glue.getByRole("button", { name: "Mark failed" }).click();
  await glue.getByLabel("What went wrong?").fill("The top bowed: too few clamps in the middle.");
  await glue.getByRole("button", { name: "Mark failed" }).click();
  await expect(glue.getByTestId("failure-note")).toContainText("too few clamps");

  const remedy = glue.getByRole("form", { name: "Add remedy step" });
  await remedy.getByLabel("Step title").fill("Re-glue with cauls");
  await remedy.getByLabel("Hands-on minutes").fill("45");
  await remedy.getByLabel("Wait after").fill("1");
  await remedy.getByLabel("Wait unit").selectOption("days");
  await remedy.getByRole("button", { name: "Add remedy step" }).click();

  // The timeline says what it is: elapsed durations with the team's people counted, not a schedule.
  await expect(page.getByTestId("plan-time-note")).toContainText("not clock times and not a shoot schedule");
  await expect(page.getByTestId("plan-totals")).toContainText(/With \d+ people/);
  const titles = page.getByTestId("build-step").locator("h3");
  await expect(titles).toHaveText(["Mill the stock", "Glue up the top", "Re-glue with cauls", "Oil finish"]);
  await expect(page.locator('[data-step-title="Re-glue with cauls"]')).toContainText("Remedy for “Glue up the top”");

  await page.locator("figure").first().screenshot({ path: path.join(SHOTS, "build-timeline.png") });
  await shot(page, "build-plan");

  // Cut list: add a part, then a bad CSV is refused line by line.
  await page.getByRole("link", { name: "Cut list" }).click();
  await expect(page.getByTestId("cut-list-empty")).toBeVisible();
  const part = page.getByRole("form", { name: "Add a part" });
  await part.getByLabel("Part", { exact: true }).fill("Top");
  await part.getByLabel("Material (species or sheet)").fill("Cherry");
  await part.getByLabel("Thickness").fill("3/4");
  await part.getByLabel("Width").fill("16");
  await part.getByLabel("Length").fill("48");
  await part.getByLabel("Unit price (USD)").fill("11.00");
  await part.getByRole("button", { name: "Add part" }).click();
  // 3/4 × 16 × 48 / 144 = 4 BF; with 15 % waste at $11.00 = $50.60.
  await expect(page.getByTestId("cut-list-total")).toContainText("4.00");
  await expect(page.getByTestId("cut-list-total")).toContainText("$50.60");
  const header = "part,material,unit,thickness,width,length,quantity,sizing,pricing_unit,unit_price,currency,waste_percent,step,supplier_note";
  await page.getByTestId("csv-import").setInputFiles({ name: "bad.csv", mimeType: "text/csv", buffer: Buffer.from(`${header}\nLeg,Cherry,in,1-1/0,2,20,4,actual,board_foot,9,USD,10,,\n`) });
  await expect(page.getByTestId("cut-list-notice")).toContainText("line 2: thickness");
  await shot(page, "cut-list");
});
