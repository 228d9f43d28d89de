import { test } from "@playwright/test";
import { SignInPage, expect, shot } from "./pages";

test.use({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });

test("notes written at the bench with no signal are kept, then stored exactly once when the signal returns", async ({ page, context }) => {
  await new SignInPage(page).signIn("presenter@jigboard.example");
  const channelId = page.url().split("/c/")[1]!;
  const episodes = (await (await page.request.get(`/api/channels/${channelId}/episodes`)).json()).episodes as { id: string; title: string }[];
  const table = episodes.find((e) => e.title.startsWith("Walnut side table"))!;
  await page.goto(`/c/${channelId}/workshop/${table.id}`);
  await expect(page.getByTestId("workshop")).toBeVisible();
  await expect(page.getByTestId("queue-state")).toHaveText("All notes saved");
  await shot(page, "workshop-390");

  await context.setOffline(true);
  await expect(page.getByTestId("connection")).toContainText("No signal");
  const stamp = Date.now().toString(36);
  const texts = [`In hindsight, the string stretched; use a batten (${stamp} 1)`, `Second clamp pad slipped; tape it (${stamp} 2)`, `Re-shoot the glue squeeze-out close (${stamp} 3)`];
  for (const [i, t] of texts.entries()) {
    await page.getByLabel(/^Note/).fill(t);
    await page.getByRole("button", { name: "Save note" }).click();
    await expect(page.getByTestId("queue-state")).toHaveAttribute("data-waiting", String(i + 1));
  }
  await expect(page.getByTestId("queue-state")).toHaveAttribute("data-waiting", "3");
  await expect(page.getByTestId("queue-state")).toContainText("3 notes waiting to send");
  await shot(page, "workshop-offline-queue-390");

  await context.setOffline(false);
  await expect(page.getByTestId("queue-state")).toHaveText("All notes saved", { timeout: 20_000 });
  const stored = (await (await page.request.get(`/api/episodes/${table.id}/shoot-log`)).json()).notes as { id: string; text: string }[];
  for (const t of texts) expect(stored.filter((n) => n.text === t), t).toHaveLength(1);
  // The same note sent again (a retry whose answer was lost) is not stored twice.
  const one = stored.find((n) => n.text === texts[0])!;
  const again = await page.request.post(`/api/episodes/${table.id}/shoot-log`, { data: { id: one.id, text: texts[0] } });
  expect(again.status()).toBe(200);
  const after = (await (await page.request.get(`/api/episodes/${table.id}/shoot-log`)).json()).notes as { text: string }[];
  expect(after.filter((n) => n.text === texts[0])).toHaveLength(1);
  await expect(page.getByTestId("notes").locator('li[data-state="saved"]').filter({ hasText: stamp })).toHaveCount(3);

  // One action turns a note into a voice-over segment, keeping the link.
  const note = page.getByTestId("notes").locator('li[data-state="saved"]').filter({ hasText: texts[2]! });
  await note.getByRole("button", { name: "Make it a voice-over" }).click();
  await expect(note).toContainText("In the script");
  const script = (await (await page.request.get(`/api/episodes/${table.id}/script`)).json()) as { segments: { kind: string; text: string }[] };
  expect(script.segments.filter((x) => x.kind === "voice_over" && x.text === texts[2])).toHaveLength(1);
});

test("the workshop view installs: a manifest and a service worker that serves the page without a signal", async ({ page, context }) => {
  await new SignInPage(page).signIn("presenter@jigboard.example");
  const channelId = page.url().split("/c/")[1]!;
  const manifest = await page.request.get("/manifest.webmanifest");
  expect(manifest.ok()).toBe(true);
  expect((await manifest.json()).display).toBe("standalone");
  const episodes = (await (await page.request.get(`/api/channels/${channelId}/episodes`)).json()).episodes as { id: string; title: string }[];
  const table = episodes.find((e) => e.title.startsWith("Walnut side table"))!;
  const url = `/c/${channelId}/workshop/${table.id}`;
  await page.goto(url);
  await page.waitForFunction(async () => Boolean((await navigator.serviceWorker.getRegistration())?.active), null, { timeout: 20_000 });
  // Seen once under the worker's control, the page then opens offline: wait until the
  // worker has stored the page and its scripts (it stores them after answering).
  await page.reload();
  await expect(page.getByTestId("workshop")).toBeVisible();
  await page.waitForFunction(
    async (u) => {
      if (!(await (await caches.open("pages")).match(u))) return false;
      const scripts = [...document.querySelectorAll<HTMLScriptElement>("script[src]")].map((x) => x.src).filter((x) => x.includes("/_next/static/"));
      for (const src of scripts) if (!(await caches.match(src, { ignoreSearch: true }))) return false;
      return true;
    },
    url,
    { timeout: 20_000 },
  );
  await context.setOffline(true);
  await page.reload();
  await expect(page.getByTestId("workshop")).toBeVisible();
  await expect(page.getByTestId("connection")).toContainText("No signal");
  await context.setOffline(false);
});
