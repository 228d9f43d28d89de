import { test } from "@playwright/test";
import { SignInPage, expect, shot } from "./pages";

test("producer schedules a build around a glue-up, sends the call sheet, and the owner reads it in the dev mailbox", async ({ page, browser }) => {
  await new SignInPage(page).signIn("producer@jigboard.example");
  const channelId = page.url().split("/c/")[1]!;
  const title = `Porch swing ${Date.now().toString(36)}`;
  const { episode } = (await (await page.request.post(`/api/channels/${channelId}/episodes`, { data: { title, stage: "planning" } })).json()) as { episode: { id: string } };

  // The presenter's plan: mill, a glue-up that cures for a day, then flatten.
  const presenter = await browser.newContext();
  const pp = await presenter.newPage();
  await new SignInPage(pp).signIn("presenter@jigboard.example");
  const add = async (body: Record<string, unknown>) => ((await (await pp.request.post(`/api/episodes/${episode.id}/steps`, { data: body })).json()) as { step: { id: string } }).step.id;
  const mill = await add({ title: "Mill the slats", activeMinutes: 120 });
  const glue = await add({ title: "Glue up the seat", activeMinutes: 90, waitMinutes: 20 * 60, waitReason: "glue cures", dependsOn: [mill] });
  await add({ title: "Flatten the seat", activeMinutes: 120, dependsOn: [glue] });
  await presenter.close();

  // Two shoot days through the form.
  await page.goto(`/c/${channelId}/shoot-days`);
  for (const date of ["2027-04-10", "2027-04-11"]) {
    await page.getByRole("button", { name: "New shoot day" }).click();
    const form = page.getByRole("form", { name: "New shoot day" });
    await form.getByLabel("Date").fill(date);
    await form.getByLabel("Episode").selectOption({ label: title });
    await form.getByLabel("Location").fill("Side yard");
    await form.getByText("Tomas Reyes").click();
    await form.getByText("Dev Halloran").click();
    await form.getByRole("button", { name: "Add shoot day" }).click();
    await expect(page.getByRole("status").filter({ hasText: `Shoot day added on ${date}` })).toBeVisible();
  }
  // A wrong hour is refused by its label.
  await page.getByRole("button", { name: "New shoot day" }).click();
  const bad = page.getByRole("form", { name: "New shoot day" });
  await bad.getByLabel("Call").fill("16:00");
  await bad.getByLabel("Wrap").fill("08:00");
  await bad.getByRole("button", { name: "Add shoot day" }).click();
  await expect(bad.getByRole("alert").first()).toContainText("Wrap: wrap must be after call");
  await bad.getByRole("button", { name: "Close" }).click();

  // The schedule: the flattening lands on the second day, after the cure.
  await page.goto(`/c/${channelId}/episodes/${episode.id}/schedule`);
  const days = page.getByTestId("schedule-days");
  await expect(days.getByRole("listitem").filter({ hasText: "Saturday 10 April" })).toContainText("Glue up the seat");
  const sunday = days.getByRole("listitem").filter({ hasText: "Sunday 11 April" });
  // Glue out of the clamps at 12:30 on Saturday, 20 h of cure: 08:30 on Sunday, so the 09:00 call.
  await expect(sunday.getByTestId("scheduled-step").filter({ hasText: "Flatten the seat" })).toContainText("09:00–11:00");
  await expect(days).toContainText("then glue cures until Sun 11 Apr 08:30");
  await page.getByRole("button", { name: "Plan and save" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Schedule saved. 3 steps moved." })).toBeVisible();
  await shot(page, "schedule");

  // The call sheet for Sunday, sent to the crew.
  await page.goto(`/c/${channelId}/shoot-days`);
  await page.getByRole("radio", { name: "List" }).click();
  const row = page.getByTestId("list-view").getByRole("row").filter({ hasText: "Sun 11 Apr" });
  await row.getByRole("link", { name: "Open" }).click();
  await expect(page.getByRole("article", { name: "Call sheet" })).toContainText(title);
  await expect(page.getByTestId("call-sheet-step")).toContainText("09:00–11:00 Flatten the seat");
  await expect(page.getByRole("article", { name: "Call sheet" })).toContainText("Follow the manufacturer's instructions");
  await page.getByRole("button", { name: "Send to the crew" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Call sheet queued to" })).toBeVisible();
  await expect(async () => {
    await page.reload();
    await expect(page.getByTestId("call-sheet-sends")).toContainText(": sent");
  }).toPass({ timeout: 20_000 });
  await shot(page, "call-sheet");

  // The owner reads it in the dev mailbox, with the .ics attached.
  const owner = await browser.newContext();
  const op = await owner.newPage();
  await new SignInPage(op).signIn("owner@jigboard.example");
  await op.goto(`/c/${channelId}/mailbox`);
  const mail = op.getByTestId("mail-message").filter({ hasText: `Call sheet: ${title}, 2027-04-11` });
  await expect(mail).toContainText(/09:00–11:00\s+Flatten the seat/);
  await expect(mail.getByTestId("mail-attachments")).toContainText("shoot-day-2027-04-11.ics (text/calendar");
  await owner.close();

  // The week view with both days.
  await page.goto(`/c/${channelId}/shoot-days`);
  await page.getByRole("radio", { name: "Week" }).click();
  for (let i = 0; i < 30 && !(await page.getByRole("heading", { name: "Week of 5 Apr 2027" }).isVisible()); i++) await page.getByRole("button", { name: "Later" }).click();
  await expect(page.getByTestId("week-view")).toContainText(title);
  await shot(page, "shoot-days-week");

  // Drag Sunday's day to Monday in the month view; its hours go with it.
  await page.getByRole("radio", { name: "Month" }).click();
  await expect(page.getByRole("heading", { name: "April 2027" })).toBeVisible();
  const handle = page.getByRole("button", { name: "Drag the shoot day on Sun 11 Apr to another date" });
  const target = page.locator('[data-date="2027-04-12"]');
  const from = (await handle.boundingBox())!;
  const to = (await target.boundingBox())!;
  await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2);
  await page.mouse.down();
  await page.mouse.move(from.x + 20, from.y + 10, { steps: 4 });
  await page.mouse.move(to.x + to.width / 2, to.y + to.height / 2, { steps: 10 });
  await page.mouse.up();
  await expect(page.getByRole("status").filter({ hasText: "Moved the shoot day from Sun 11 Apr to Mon 12 Apr" })).toBeVisible();
  await expect(target.getByTestId("shoot-day-chip")).toContainText("09:00–17:00");
  await shot(page, "shoot-days-month");
});
