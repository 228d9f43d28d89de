import { test } from "@playwright/test";
import pg from "pg";
import bcrypt from "bcryptjs";
import { BoardPage, DEMO_PASSWORD, SignInPage, expect, shot } from "./pages";

// The harness runs two app instances on one database, as behind a load balancer.
const A = process.env.JIGBOARD_TEST_URL ?? "http://127.0.0.1:3100";
const B = process.env.JIGBOARD_TEST_URL_B ?? "http://127.0.0.1:3101";

test("a change made through one instance appears live in a browser on the other", async ({ browser }) => {
  const onB = await browser.newContext({ baseURL: B });
  const page = await onB.newPage();
  await new SignInPage(page).signIn("editor@jigboard.example");
  const channelId = page.url().split("/c/")[1]!;
  await expect(page.getByTestId("live-state")).toHaveAttribute("data-state", "live");

  const onA = await browser.newContext({ baseURL: A });
  const pa = await onA.newPage();
  await new SignInPage(pa).signIn("presenter@jigboard.example");
  const title = `Live on the other instance ${Date.now().toString(36)}`;
  const created = await pa.request.post(`${A}/api/channels/${channelId}/episodes`, { data: { title, stage: "planning" } });
  expect(created.status()).toBe(201);
  const episode = ((await created.json()) as { episode: { id: string } }).episode;
  // No reload on B: the card arrives through the event stream.
  await expect(new BoardPage(page).card(title)).toBeVisible({ timeout: 10_000 });
  await shot(page, "live-board-instance-b");

  // A script segment written through A shows in B's open script, and presence names who is in it.
  const seg = ((await (await pa.request.post(`${A}/api/episodes/${episode.id}/script`, { data: { kind: "voice_over", text: "Mark the shoulders with a knife, not a pencil." } })).json()) as { segment: { id: string; version: number } }).segment;
  await page.goto(`/c/${channelId}/episodes/${episode.id}/script`);
  // The editor reads the words as text (only the presenter and owner write them).
  await expect(page.getByText("Mark the shoulders with a knife, not a pencil.")).toBeVisible();
  await expect(page.getByTestId("live-state")).toHaveAttribute("data-state", "live");
  await pa.request.patch(`${A}/api/segments/${seg.id}`, { data: { version: seg.version, text: "Mark the shoulders with a knife, then deepen the line with a chisel." } });
  await expect(page.getByText("Mark the shoulders with a knife, then deepen the line with a chisel.")).toBeVisible({ timeout: 10_000 });
  await pa.request.post(`${A}/api/episodes/${episode.id}/presence`, { data: { segmentId: seg.id } });
  await expect(page.getByTestId("presence")).toContainText("Tomas Reyes is editing this segment");
  await shot(page, "live-script-presence");
  await onA.close();
  await onB.close();
});

test("a member removed from the channel stops receiving, and is told", async ({ browser }) => {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  const email = `temp-${Date.now().toString(36)}@jigboard.example`;
  const { rows } = await client.query<{ id: string }>("insert into users (email, name, password_hash) values ($1, 'Temporary editor', $2) returning id", [email, await bcrypt.hash(DEMO_PASSWORD, 4)]);
  const { rows: ch } = await client.query<{ id: string }>("select id from channels where name = 'Crooked Kerf Workshop'");
  await client.query("insert into memberships (channel_id, user_id, roles) values ($1, $2, '{editor}')", [ch[0]!.id, rows[0]!.id]);

  const ctx = await browser.newContext({ baseURL: B });
  const page = await ctx.newPage();
  await new SignInPage(page).signIn(email);
  await expect(page.getByTestId("live-state")).toHaveAttribute("data-state", "live");
  // The owner removes them through the other instance.
  const owner = await browser.newContext({ baseURL: A });
  const po = await owner.newPage();
  await new SignInPage(po).signIn("owner@jigboard.example");
  const removed = await po.request.delete(`${A}/api/channels/${ch[0]!.id}/members/${rows[0]!.id}`);
  expect(removed.status(), await removed.text()).toBe(200);
  await expect(page.getByTestId("live-revoked")).toBeVisible({ timeout: 10_000 });
  await expect(page.getByTestId("live-state")).toHaveAttribute("data-state", "revoked");
  await client.end();
  await ctx.close();
  await owner.close();
});
