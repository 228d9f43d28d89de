import { test } from "@playwright/test";
import { SignInPage, expect, shot } from "./pages";

test("presenter writes a timed script, pins a timecode, resolves a two-window conflict and reads it through", async ({ page, context }) => {
  await new SignInPage(page).signIn("presenter@jigboard.example");
  const channelId = page.url().split("/c/")[1]!;
  const created = await page.request.post(`/api/channels/${channelId}/episodes`, {
    data: { title: `Spoon rack ${Date.now().toString(36)}`, stage: "planning", frameRate: "25", targetRuntimeSeconds: 60 },
  });
  const { episode } = (await created.json()) as { episode: { id: string } };
  const url = `/c/${channelId}/episodes/${episode.id}/script`;
  await page.goto(url);
  await expect(page.getByTestId("script-empty")).toBeVisible();

  await page.getByRole("button", { name: "Add segment" }).click();
  const first = page.getByTestId("segment").nth(0);
  // 75 words at 150 wpm is 30 s.
  await first.getByRole("textbox", { name: "Segment 1 text" }).fill(Array.from({ length: 75 }, (_, i) => `word${i}`).join(" "));
  await expect(page.getByTestId("script-save-state")).toHaveText("All changes saved");

  await page.getByRole("button", { name: "Add segment" }).click();
  const second = page.getByTestId("segment").nth(1);
  await second.getByRole("textbox", { name: "Segment 2 text" }).fill("Now the glue goes on. {2s} Clamps next.");
  await expect(second.getByTestId("segment-start")).toHaveText("00:00:30:00");

  // Pin the second segment at 40 s: the estimate reaches it at 30 s, 10 s before the pin.
  await second.getByRole("textbox", { name: "Pinned start timecode" }).fill("0:40");
  await second.getByRole("textbox", { name: "Pinned start timecode" }).blur();
  await expect(second.getByTestId("drift")).toContainText("ends 10.0 s before this pin");
  await expect(second.getByTestId("segment-start")).toHaveText("00:00:40:00");
  // A label that does not exist is refused with a reason.
  await second.getByRole("textbox", { name: "Pinned start timecode" }).fill("00:00:61:00");
  await second.getByRole("textbox", { name: "Pinned start timecode" }).blur();
  await expect(second.getByRole("alert")).toContainText("seconds run from 00 to 59");
  await expect(page.getByTestId("runtime-vs-target")).toContainText("under the target");
  await shot(page, "script-editor");

  // Two windows on the same segment: with live updates, the second shows the first's words without a reload.
  const watching = await context.newPage();
  await watching.goto(url);
  await expect(watching.getByTestId("segment")).toHaveCount(2);
  await expect(watching.getByTestId("live-state")).toHaveAttribute("data-state", "live");
  const mine = first.getByRole("textbox", { name: "Segment 1 text" });
  await mine.fill("Intro from window one.");
  await expect(page.getByTestId("script-save-state")).toHaveText("All changes saved");
  await expect(watching.getByTestId("segment").nth(0).getByRole("textbox", { name: "Segment 1 text" })).toHaveValue("Intro from window one.");
  await watching.close();

  // A window that has not heard of the change (its live stream cut) and types over it gets both texts and a merge.
  const other = await context.newPage();
  await other.route(/\/api\/channels\/[^/]+\/live/, (r) => r.fulfill({ status: 204, body: "" }));
  await other.goto(url);
  await expect(other.getByTestId("segment")).toHaveCount(2);
  await mine.fill("Intro again from window one.");
  await expect(page.getByTestId("script-save-state")).toHaveText("All changes saved");
  const theirs = other.getByTestId("segment").nth(0).getByRole("textbox", { name: "Segment 1 text" });
  await theirs.fill("Intro from window two.");
  const conflict = other.getByTestId("conflict");
  await expect(conflict).toBeVisible();
  await expect(conflict.getByTestId("conflict-mine")).toHaveText("Intro from window two.");
  await expect(conflict.getByTestId("conflict-theirs")).toHaveText("Intro again from window one.");
  await shot(other, "script-conflict");
  await conflict.getByRole("button", { name: "Save merged text" }).click();
  await expect(other.getByTestId("script-save-state")).toHaveText("All changes saved");

  await page.reload();
  const merged = await page.getByTestId("segment").nth(0).getByRole("textbox", { name: "Segment 1 text" }).inputValue();
  // Three-way merge from the text both started from ("Intro from window one."): one added "again", the other changed "one" to "two".
  expect(merged).toBe("Intro again from window two.");
  await other.close();

  await page.getByRole("link", { name: "Read-through" }).click();
  await expect(page.getByTestId("read-item")).toHaveCount(2);
  await expect(page.getByTestId("read-item").first()).toHaveAttribute("aria-current", "step");
  await page.keyboard.press("ArrowDown");
  await expect(page.getByTestId("read-item").nth(1)).toHaveAttribute("aria-current", "step");
  await shot(page, "read-through");
});
