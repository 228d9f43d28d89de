import { test } from "@playwright/test";
import pg from "pg";
import { BoardPage, SignInPage, expect, shot } from "./pages";

test("presenter creates an episode, moves it by keyboard and by menu, and it persists", async ({ page }) => {
  const title = `Trestle table ${Date.now().toString(36)}`;
  await new SignInPage(page).signIn("presenter@jigboard.example");
  const board = new BoardPage(page);

  await page.getByRole("button", { name: "New episode" }).click();
  const form = page.getByRole("form", { name: "New episode" });
  await form.getByRole("button", { name: "Add episode" }).click();
  await expect(form.getByText("give the episode a title")).toBeVisible();
  await form.getByLabel("Title").fill(title);
  await form.getByLabel("Target runtime (minutes or m:ss)").fill("12:30");
  await form.getByLabel("Planned publish date").fill("2027-03-12");
  await form.getByRole("button", { name: "Add episode" }).click();
  await expect(board.column("Sketchbook").getByTestId("episode-card").filter({ hasText: title })).toBeVisible();
  await expect(board.card(title)).toContainText("12:30");
  // Sighted users see the new episode named, with a way to open it.
  await expect(page.getByTestId("board-added")).toContainText(`Added “${title}” to 1 · Sketchbook`);
  await expect(page.getByTestId("board-added").getByRole("link", { name: "Open it to plan the build" })).toBeVisible();

  // Keyboard drag: pick up with space, arrow to the next stage, drop with space.
  const handle = board.card(title).getByRole("button", { name: new RegExp(`^Drag ${title}`) });
  await handle.focus();
  const dndLive = page.locator('[id^="DndLiveRegion"]');
  await page.keyboard.press("Space");
  await expect(dndLive).toContainText(`“${title}” is over Sketchbook`);
  // Give the sensor a moment to measure the columns, as a person's key presses would.
  await page.waitForTimeout(300);
  await page.keyboard.press("ArrowRight");
  await expect(dndLive).toContainText(`“${title}” is over Planning`);
  await page.keyboard.press("Space");
  await expect(board.status()).toContainText(`Moved “${title}” to Planning`);
  await expect(board.column("Planning").getByTestId("episode-card").filter({ hasText: title })).toBeVisible();

  // The non-drag way (WCAG 2.2 2.5.7).
  await board.moveWithMenu(title, "Editing");
  await expect(board.status()).toContainText(`Moved “${title}” to Editing`);
  await page.reload();
  await expect(board.column("Editing").getByTestId("episode-card").filter({ hasText: title })).toBeVisible();

  // The menu by keyboard alone: Enter opens it on its first item, arrows move, Enter chooses, focus returns (WAI-ARIA menu button pattern).
  const trigger = board.card(title).getByRole("button", { name: "Move to…" });
  await trigger.focus();
  await page.keyboard.press("Enter");
  const menu = page.getByRole("menu", { name: `Move ${title}` });
  await expect(menu).toBeVisible();
  await shot(page, "board-move-menu");
  await page.keyboard.press("Escape");
  await expect(menu).toHaveCount(0);
  await expect(trigger).toBeFocused();
  await page.keyboard.press("Enter");
  await expect(menu.getByRole("menuitem", { name: /Final check$/ })).toBeVisible();
  for (let i = 0; i < 8 && !(await menu.getByRole("menuitem", { name: /Final check$/ }).evaluate((el) => el === document.activeElement)); i++) await page.keyboard.press("ArrowDown");
  await page.keyboard.press("Enter");
  await expect(board.status()).toContainText(`Moved “${title}” to Final check`);
  await expect(board.column("Final check").getByTestId("episode-card").filter({ hasText: title })).toBeVisible();
  await board.moveWithMenu(title, "Editing");
  await expect(board.status()).toContainText(`Moved “${title}” to Editing`);
  await shot(page, "board-presenter");

  // Edit through the same form and schema; the stored runtime comes back as minutes.
  await board.card(title).getByRole("link", { name: title }).click();
  const edit = page.getByRole("form", { name: "Edit episode" });
  await expect(edit.getByLabel("Target runtime (minutes or m:ss)")).toHaveValue("12:30");
  await edit.getByLabel("Target runtime (minutes or m:ss)").fill("0:05");
  await edit.getByRole("button", { name: "Save changes" }).click();
  await expect(edit.getByText("at least 10 seconds")).toBeVisible();
  await edit.getByLabel("Target runtime (minutes or m:ss)").fill("14");
  await edit.getByLabel("Title").fill(`${title} (oak)`);
  await edit.getByRole("button", { name: "Save changes" }).click();
  await expect(edit.getByText("Saved.")).toBeVisible();
  await page.reload();
  await expect(page.getByRole("heading", { name: `${title} (oak)` })).toBeVisible();
  await expect(page.getByRole("form", { name: "Edit episode" }).getByLabel("Target runtime (minutes or m:ss)")).toHaveValue("14");
  await shot(page, "episode-edit");

  // Archiving takes it off the board; restoring brings it back to its stage.
  await page.getByRole("button", { name: "Archive episode" }).click();
  await page.getByRole("button", { name: "Yes, archive" }).click();
  await page.waitForURL(/\/c\/[0-9a-f-]+$/);
  await expect(board.card(`${title} (oak)`)).toHaveCount(0);
  await page.getByRole("button", { name: "Show archived episodes" }).click();
  await page.getByTestId("archived-list").getByRole("listitem").filter({ hasText: `${title} (oak)` }).getByRole("button", { name: "Restore" }).click();
  await expect(board.column("Editing").getByTestId("episode-card").filter({ hasText: `${title} (oak)` })).toBeVisible();
});

test("sponsor liaison reads the board but moving is refused", async ({ page }) => {
  await new SignInPage(page).signIn("sponsors@jigboard.example");
  const board = new BoardPage(page);
  await expect(page.getByRole("button", { name: /^Drag / })).toHaveCount(0);
  await expect(page.getByRole("button", { name: "New episode" })).toHaveCount(0);
  const first = page.getByTestId("episode-card").first();
  await first.getByRole("button", { name: "Move to…" }).click();
  await expect(page.getByRole("menu").getByTestId("move-refused")).toContainText("can read the board but not move episodes");
  await shot(page, "board-sponsor-liaison");
  // The server refuses too, whatever the page shows.
  const id = await first.getAttribute("data-episode-id");
  const r = await page.request.patch(`/api/episodes/${id}`, { data: { stage: "published", position: 0 } });
  expect(r.status()).toBe(403);
  void board;
});

test("a move the server refuses rolls back with a visible message", async ({ page }) => {
  await new SignInPage(page).signIn("producer@jigboard.example");
  const board = new BoardPage(page);
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  const userId = (await client.query("select id from users where email = 'producer@jigboard.example'")).rows[0].id as string;
  try {
    // The owner takes the producer role away while the page is open.
    await client.query("update memberships set roles = '{editor}' where user_id = $1", [userId]);
    const title = "Folding sawhorses that nest flat";
    await board.moveWithMenu(title, "Planning");
    await expect(page.getByTestId("board-error")).toContainText("was not moved");
    await expect(board.column("Sketchbook").getByTestId("episode-card").filter({ hasText: title })).toBeVisible();
    await shot(page, "board-move-refused");
  } finally {
    await client.query("update memberships set roles = '{producer}' where user_id = $1", [userId]);
    await client.end();
  }
});

test("owner invites a person who reads the mail, joins and signs in", async ({ page, browser }) => {
  const email = `woodturner-${Date.now().toString(36)}@jigboard.example`;
  await new SignInPage(page).signIn("owner@jigboard.example");
  await page.getByRole("link", { name: "People" }).click();
  await page.getByLabel("E-mail").fill(email);
  await page.getByRole("checkbox", { name: "Presenter" }).last().uncheck();
  await page.getByRole("checkbox", { name: "Editor" }).last().check();
  await page.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByText(`Invitation sent to ${email}.`)).toBeVisible();
  await shot(page, "people-owner");

  await page.getByRole("link", { name: "Dev mailbox" }).click();
  const message = page.getByTestId("mail-message").filter({ hasText: email }).first();
  await expect(message).toBeVisible();
  const link = await message.getByRole("link").first().getAttribute("href");
  await shot(page, "dev-mailbox");

  const guest = await browser.newContext();
  const p2 = await guest.newPage();
  await p2.goto(new URL(link!).pathname);
  await p2.getByLabel("Your name").fill("Noor Varga");
  await p2.getByLabel("Password").fill("turning-on-the-lathe");
  await p2.getByRole("button", { name: "Join the channel" }).click();
  await p2.waitForURL(/\/sign-in\?joined=1/);
  await p2.getByLabel("E-mail").fill(email);
  await p2.getByLabel("Password").fill("turning-on-the-lathe");
  await p2.getByRole("button", { name: "Sign in" }).click();
  await p2.waitForURL(/\/c\//);
  await expect(p2.getByRole("banner")).toContainText("Noor Varga");
  await expect(p2.getByRole("banner")).toContainText("Editor");
  await shot(p2, "board-new-editor");
  await guest.close();
});

test("card figures fit their cells on a 1280 px laptop (nothing cut off or running into the next label)", async ({ browser }) => {
  const ctx = await browser.newContext({ viewport: { width: 1280, height: 800 } });
  const page = await ctx.newPage();
  await new SignInPage(page).signIn("owner@jigboard.example");
  await expect(page.getByTestId("episode-card").first()).toBeVisible();
  const clipped = await page.evaluate(() =>
    [...document.querySelectorAll<HTMLElement>('[data-testid^="card-"]')].filter((el) => el.scrollWidth > el.clientWidth + 1).map((el) => `${el.dataset.testid}: ${el.textContent}`),
  );
  expect(clipped).toEqual([]);
  await ctx.close();
});
