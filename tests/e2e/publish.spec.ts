import { test } from "@playwright/test";
import zlib from "node:zlib";
import { BoardPage, SignInPage, expect, shot } from "./pages";

/** A real 2×2 PNG (signature, IHDR, IDAT, IEND; PNG spec, W3C REC-PNG-20031110), so the browser can show it. */
function png(): Buffer {
  const crcTable = Array.from({ length: 256 }, (_, n) => {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    return c >>> 0;
  });
  const crc = (b: Buffer) => {
    let c = 0xffffffff;
    for (const x of b) c = crcTable[(c ^ x) & 0xff]! ^ (c >>> 8);
    return (c ^ 0xffffffff) >>> 0;
  };
  const chunk = (type: string, data: Buffer) => {
    const len = Buffer.alloc(4);
    len.writeUInt32BE(data.length);
    const body = Buffer.concat([Buffer.from(type, "ascii"), data]);
    const sum = Buffer.alloc(4);
    sum.writeUInt32BE(crc(body));
    return Buffer.concat([len, body, sum]);
  };
  const ihdr = Buffer.from([0, 0, 0, 2, 0, 0, 0, 2, 8, 2, 0, 0, 0]);
  const raw = Buffer.from([0, 200, 120, 60, 40, 90, 140, 0, 40, 90, 140, 200, 120, 60]);
  return Buffer.concat([Buffer.from([137, 80, 78, 71, 13, 10, 26, 10]), chunk("IHDR", ihdr), chunk("IDAT", zlib.deflateSync(raw)), chunk("IEND", Buffer.alloc(0))]);
}

test("an episode is published once its checklist passes; another only with the owner's recorded reason", async ({ page }) => {
  await new SignInPage(page).signIn("owner@jigboard.example");
  const channelId = page.url().split("/c/")[1]!;
  const title = `Bench hook ${Date.now().toString(36)}`;
  const { episode } = (await (await page.request.post(`/api/channels/${channelId}/episodes`, { data: { title, stage: "review", frameRate: "25" } })).json()) as { episode: { id: string } };
  // Three chapters of at least 10 s each (at 25 fps, 250 frames is 10 s); the text between the to-camera parts keeps each under the cutaway limit.
  let after: string | null = null;
  for (const [kind, text, frames, chapter] of [
    ["to_camera", "A bench hook from one offcut of beech.", 300, "Why a bench hook"],
    ["on_screen_text", "Cut list: one beech offcut, two oak strips", 250, "Cutting the parts"],
    ["to_camera", "Glue, square it, and it will outlast the bench.", 300, "Glue up"],
  ] as const) {
    const r: import("@playwright/test").APIResponse = await page.request.post(`/api/episodes/${episode.id}/script`, { data: { afterId: after, kind, text, explicitDurationFrames: frames, chapterStart: true, chapterTitle: chapter } });
    after = ((await r.json()) as { segment: { id: string } }).segment.id;
  }

  await page.goto(`/c/${channelId}/episodes/${episode.id}/publish`);
  const item = (key: string) => page.getByTestId("checklist").locator(`li[data-key="${key}"]`);
  await expect(page.getByTestId("checklist-state")).toHaveText("2 to fix");
  await expect(item("script_final")).toHaveAttribute("data-pass", "false");
  await expect(page.getByRole("button", { name: "Move to published" })).toBeDisabled();

  await page.getByLabel("Video title").fill("A bench hook that outlasts the bench");
  await page.getByLabel("Opening").click();
  await expect(page.getByTestId("meter-title")).toContainText("36 / 100 characters");
  await page.getByLabel("Opening").fill("One offcut, two strips, twenty minutes.");
  await page.getByLabel("Closing (links, thanks)").click();
  await expect(page.getByTestId("description-preview")).toContainText("One offcut, two strips, twenty minutes.");
  await expect(page.getByTestId("description-preview")).toContainText("Chapters\n0:00 Why a bench hook\n0:12 Cutting the parts\n0:22 Glue up");
  await page.getByLabel("Thumbnail image").setInputFiles({ name: "thumb.png", mimeType: "image/png", buffer: png() });
  await expect(page.getByRole("img", { name: "Thumbnail" })).toBeVisible();
  await item("script_final").getByRole("button", { name: "Mark the script final" }).click();
  await expect(page.getByTestId("checklist-state")).toHaveText("All clear");
  await shot(page, "publish-ready");
  await page.getByRole("button", { name: "Move to published" }).click();
  await expect(page.getByTestId("published")).toBeVisible();
  const stage = ((await (await page.request.get(`/api/episodes/${episode.id}`)).json()) as { episode: { stage: string } }).episode.stage;
  expect(stage).toBe("published");

  // A second episode with nothing done: the board refuses the move and points at the checklist.
  const other = `Shop stool ${Date.now().toString(36)}`;
  const second = ((await (await page.request.post(`/api/channels/${channelId}/episodes`, { data: { title: other, stage: "review" } })).json()) as { episode: { id: string } }).episode;
  await page.goto(`/c/${channelId}`);
  const board = new BoardPage(page);
  await board.moveWithMenu(other, "Published");
  await expect(page.getByTestId("board-error")).toContainText("The publish checklist fails");
  await page.getByRole("link", { name: "Open the publish checklist" }).click();
  await expect(page).toHaveURL(new RegExp(`/episodes/${second.id}/publish$`));
  await page.getByLabel("Publish anyway (owner): why?").fill("Filmed for the archive only; no release on the platform.");
  await page.getByRole("button", { name: "Publish with the checklist failing" }).click();
  await expect(page.getByTestId("published")).toBeVisible();
  await expect(page.getByText("Filmed for the archive only; no release on the platform.")).toBeVisible();
  await shot(page, "publish-override");
});

test("the channel overview shows the whole channel at a glance, each row linking to its source", async ({ page }) => {
  await new SignInPage(page).signIn("producer@jigboard.example");
  const channelId = page.url().split("/c/")[1]!;
  await page.getByRole("link", { name: "At a glance" }).click();
  await expect(page.getByRole("heading", { name: "Channel at a glance" })).toBeVisible();
  for (const h of ["Episodes by stage", "Script runtime against target (minutes)", "Shoot days ahead", "Publishing", "Open B-roll gaps", "Sponsor dates ahead"]) await expect(page.getByRole("heading", { name: h })).toBeVisible();
  await expect(page.locator(".recharts-surface").first()).toBeVisible();
  await expect(page.getByRole("link", { name: /Walnut side table with a floating top/ }).first()).toBeVisible();
  await shot(page, "overview");
  await page.setViewportSize({ width: 390, height: 844 });
  await shot(page, "overview-390");
  await page.getByRole("link", { name: "Planning" }).click();
  await expect(page).toHaveURL(new RegExp(`/c/${channelId}\\?stage=planning$`));
});
