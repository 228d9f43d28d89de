import { test } from "@playwright/test";
import fs from "node:fs";
import { SignInPage, expect, shot } from "./pages";

test("editor uploads footage in parts with pause and resume, lays it as B-roll and closes a gap", async ({ browser }) => {
  // The presenter sets up an episode with 10 s of voice-over (25 words at 150 wpm, 25 fps).
  const presenterCtx = await browser.newContext();
  const presenter = await presenterCtx.newPage();
  await new SignInPage(presenter).signIn("presenter@jigboard.example");
  const channelId = presenter.url().split("/c/")[1]!;
  const ep = (await (await presenter.request.post(`/api/channels/${channelId}/episodes`, { data: { title: `Coverage ${Date.now().toString(36)}`, stage: "editing", frameRate: "25" } })).json()).episode;
  const words = Array.from({ length: 25 }, (_, i) => `plank${i}`).join(" ");
  expect((await presenter.request.post(`/api/episodes/${ep.id}/script`, { data: { kind: "voice_over", text: words } })).status()).toBe(201);
  await presenterCtx.close();

  const ctx = await browser.newContext();
  const page = await ctx.newPage();
  await new SignInPage(page).signIn("editor@jigboard.example");
  const base = `/c/${channelId}/episodes/${ep.id}`;
  await page.goto(`${base}/footage`);

  // Slow storage down so the upload can be paused part-way: part 1 lands at once, the others take seconds (test only).
  await page.route(/\/jigboard-media\/channel\/.*partNumber=/, async (route) => {
    const part = Number(new URL(route.request().url()).searchParams.get("partNumber"));
    await new Promise((r) => setTimeout(r, part === 1 ? 200 : 3000));
    await route.continue().catch(() => {});
  });
  // The 4 s test pattern made with ffmpeg, padded to 11 MiB so it travels in three 5 MiB parts.
  const bytes = Buffer.concat([fs.readFileSync("db/demo-media/test-pattern.mp4"), Buffer.alloc(11 * 1024 * 1024, 0)]);
  await page.getByTestId("footage-input").setInputFiles({ name: "B002_bench_wide.mp4", mimeType: "video/mp4", buffer: bytes });
  const row = page.getByTestId("upload-row").filter({ hasText: "B002_bench_wide.mp4" });
  await expect(row.getByTestId("upload-status")).toHaveText("Uploading");
  await expect(row).toContainText("parts 0/3");
  await expect(row).toContainText("parts 1/3");
  await shot(page, "upload-progress");
  await row.getByRole("button", { name: "Pause" }).click();
  await expect(row.getByTestId("upload-status")).toHaveText("Paused");
  await expect(row).toContainText("parts 1/3");
  await row.getByRole("button", { name: "Resume" }).click();
  await expect(row.getByTestId("upload-status")).toContainText("(resumed)");
  await expect(row.getByTestId("upload-status")).toHaveText("Done (resumed)", { timeout: 30_000 });
  await expect(page.getByTestId("overall-progress").getByRole("progressbar")).toHaveAttribute("aria-valuenow", "100");

  const clip = page.getByTestId("clip-row").filter({ hasText: "B002_bench_wide.mp4" });
  await expect(clip.getByTestId("clip-duration")).toHaveText("4.00 s");
  await expect(clip.getByTestId("clip-picture")).toContainText("320×180");
  await shot(page, "footage");

  // Lay it on the script timeline: one 4 s clip leaves 6 s of voice-over bare; three close it.
  await page.goto(`${base}/coverage`);
  await expect(page.getByTestId("open-gaps")).toHaveText("1");
  const place = page.getByRole("form", { name: "Place a clip" });
  const placeAt = async (tc: string) => {
    await place.getByLabel("Clip").selectOption({ label: "B002_bench_wide.mp4 (4.0 s)" });
    await place.getByLabel("Starts at timecode").fill(tc);
    await place.getByRole("button", { name: "Place clip" }).click();
    await expect(page.getByText("Clip placed on the timeline.")).toBeVisible();
  };
  await placeAt("00:00:00:00");
  await expect(page.getByTestId("gap-item").first()).toContainText("00:00:04:00–00:00:10:00");
  await page.getByTestId("gap-item").first().getByRole("button", { name: "Pickup shot" }).click();
  await expect(page.getByText("Pickup shot added to the shot list.")).toBeVisible();
  // The gap now says a pickup is planned, and offers no second one.
  await expect(page.getByTestId("gap-item").first().getByTestId("gap-status")).toHaveText("open · pickup planned");
  await expect(page.getByTestId("gap-item").first().getByRole("button", { name: "Pickup shot" })).toHaveCount(0);
  await expect(page.getByTestId("gap-item").first().getByRole("link", { name: "See the pickup shot" })).toBeVisible();
  await page.getByTestId("broll-range").first().focus();
  await expect(page.getByTestId("timeline-focus")).toContainText("B-roll 00:00:00:00–00:00:04:00");
  await shot(page, "coverage-with-gap");
  await placeAt("00:00:04:00");
  await placeAt("00:00:08:00");
  await expect(page.getByTestId("open-gaps")).toHaveText("0");
  await expect(page.getByTestId("coverage-percent")).toHaveText("100 %");
  await shot(page, "coverage-closed");

  await page.goto(`${base}/shots`);
  await expect(page.getByTestId("shot-row").filter({ hasText: "Pickup" })).toHaveCount(1);
  await ctx.close();
});

test("an upload interrupted by a page reload resumes from the parts already stored", async ({ browser }) => {
  const ctx = await browser.newContext();
  const page = await ctx.newPage();
  await new SignInPage(page).signIn("owner@jigboard.example");
  const channelId = page.url().split("/c/")[1]!;
  const ep = (await (await page.request.post(`/api/channels/${channelId}/episodes`, { data: { title: `Reload ${Date.now().toString(36)}`, stage: "editing", frameRate: "25" } })).json()).episode;
  // A file on disk keeps its modification time, so choosing it again after the reload is recognised.
  const file = "tests/.artifacts/B003_reload.mp4";
  fs.writeFileSync(file, Buffer.concat([fs.readFileSync("db/demo-media/test-pattern.mp4"), Buffer.alloc(11 * 1024 * 1024, 7)]));
  await page.route(/\/jigboard-media\/channel\/.*partNumber=/, async (route) => {
    const part = Number(new URL(route.request().url()).searchParams.get("partNumber"));
    await new Promise((r) => setTimeout(r, part === 1 ? 200 : 5000));
    await route.continue().catch(() => {});
  });
  await page.goto(`/c/${channelId}/episodes/${ep.id}/footage`);
  await page.getByTestId("footage-input").setInputFiles(file);
  const row = () => page.getByTestId("upload-row").filter({ hasText: "B003_reload.mp4" });
  await expect(row()).toContainText("parts 1/3");

  await page.reload(); // the connection drops with parts 2 and 3 in flight
  await page.unroute(/\/jigboard-media\/channel\/.*partNumber=/);
  await page.getByTestId("footage-input").setInputFiles(file);
  await expect(row().getByTestId("upload-status")).toHaveText("Done (resumed)", { timeout: 30_000 });
  await expect(page.getByTestId("clip-row").filter({ hasText: "B003_reload.mp4" })).toHaveCount(1);
  await shot(page, "upload-resumed-after-reload");
  await ctx.close();
});

test("storage going down in the middle of an upload: the upload waits, says so, and finishes when storage is back", async ({ page }) => {
  await new SignInPage(page).signIn("editor@jigboard.example");
  const channelId = page.url().split("/c/")[1]!;
  const episodes = (await (await page.request.get(`/api/channels/${channelId}/episodes`)).json()).episodes as { id: string; title: string }[];
  const bench = episodes.find((e) => e.title.startsWith("Outdoor bench"))!;
  await page.goto(`/c/${channelId}/episodes/${bench.id}/footage`);
  // Part 1 reaches storage; then storage stops answering (every part upload fails at the connection) until it is "back".
  await page.route(/\/jigboard-media\/channel\/.*partNumber=/, async (route) => {
    const part = Number(new URL(route.request().url()).searchParams.get("partNumber"));
    if (part > 1) return route.abort("connectionrefused");
    await route.continue().catch(() => {});
  });
  const bytes = Buffer.concat([fs.readFileSync("db/demo-media/test-pattern.mp4"), Buffer.alloc(11 * 1024 * 1024, 0)]);
  await page.getByTestId("footage-input").setInputFiles({ name: "C004_outage.mp4", mimeType: "video/mp4", buffer: bytes });
  const row = page.getByTestId("upload-row").filter({ hasText: "C004_outage.mp4" });
  await expect(row.getByTestId("upload-status")).toHaveText("Waiting for storage…", { timeout: 60_000 });
  await expect(row).toContainText("Storage is not answering. The upload waits and goes on by itself when it is back.");
  await shot(page, "upload-waiting-for-storage");
  await page.unroute(/\/jigboard-media\/channel\/.*partNumber=/);
  await expect(row.getByTestId("upload-status")).toHaveText("Done", { timeout: 90_000 });
  await expect(row).toContainText("parts 3/3");
});
