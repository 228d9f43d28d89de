import { test } from "@playwright/test";
import { SignInPage, expect, shot } from "./pages";

test("liaison sets up a deal, sees a failing check against the script, and sees it pass once the read is fixed", async ({ page, browser }) => {
  await new SignInPage(page).signIn("sponsors@jigboard.example");
  const channelId = page.url().split("/c/")[1]!;
  const presenter = await browser.newContext();
  const pp = await presenter.newPage();
  await new SignInPage(pp).signIn("presenter@jigboard.example");
  const title = `Spice rack ${Date.now().toString(36)}`;
  const { episode } = (await (await pp.request.post(`/api/channels/${channelId}/episodes`, { data: { title, stage: "planning", frameRate: "25" } })).json()) as { episode: { id: string } };
  await pp.request.post(`/api/episodes/${episode.id}/script`, { data: { kind: "to_camera", text: "A spice rack from one board of cherry." } });
  const read = ((await (await pp.request.post(`/api/episodes/${episode.id}/script`, { data: { kind: "sponsor_read", text: "This video is sponsored by Marlowe Finishes, whose oil I use on everything." } })).json()) as { segment: { id: string; version: number } }).segment;

  await page.goto(`/c/${channelId}/sponsors`);
  const sp = page.getByRole("form", { name: "New sponsor" });
  await sp.getByLabel("Sponsor name").fill("Marlowe Finishes");
  await sp.getByLabel("Contact name").fill("Tess Arden");
  await sp.getByLabel("Contact e-mail").fill("tess@marlowe-finishes.example");
  await sp.getByRole("button", { name: "Add sponsor" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Sponsor added." })).toBeVisible();

  const form = page.getByRole("form", { name: "New deal" });
  await form.getByLabel("Sponsor").selectOption({ label: "Marlowe Finishes" });
  await form.getByLabel("Deal title").fill("Oil read in the spice rack");
  await form.getByLabel("Fee (USD)").fill("800");
  await form.getByLabel("Publish from").fill("2027-03-01");
  await form.getByLabel("Publish by").fill("2027-03-31");
  await form.getByText(title).click();
  await form.getByRole("button", { name: "Add deal" }).click();
  const deal = page.getByTestId("deal").filter({ hasText: "Oil read in the spice rack" });
  await expect(deal).toContainText("$800.00");
  const add = deal.getByRole("form", { name: "New deliverable for Oil read in the spice rack" });
  await add.getByLabel("Deliverable").selectOption({ label: "Talking points in the read" });
  await add.getByLabel("Talking points (separate with ;)").fill("food-safe once cured; wipe on, wipe off");
  await add.getByRole("button", { name: "Add" }).click();
  await expect(deal).toContainText("“food-safe once cured”, “wipe on, wipe off”");
  await add.getByLabel("Deliverable").selectOption({ label: "Mention starts before" });
  await add.getByLabel("Seconds").fill("60");
  await add.getByRole("button", { name: "Add" }).click();
  await add.getByLabel("Deliverable").selectOption({ label: "Disclosure said at or before the first mention" });
  await add.getByRole("button", { name: "Add" }).click();
  await expect(deal.getByRole("list", { name: "Deliverables" }).getByRole("listitem")).toHaveCount(3);

  await page.goto(`/c/${channelId}/episodes/${episode.id}/sponsors`);
  const points = page.getByTestId("check-result").filter({ hasText: "Talking points in the read" });
  await expect(points).toContainText("✕ Not met");
  await expect(points).toContainText("Missing from the read: “food-safe once cured”, “wipe on, wipe off”.");
  await expect(page.getByTestId("check-result").filter({ hasText: "Mention starts before" })).toContainText("✓ Met");
  await expect(page.getByTestId("checks-state")).toContainText("Some promises are not kept yet.");
  await shot(page, "sponsor-checks-failing");

  // The presenter fixes the read; the check follows.
  await pp.request.patch(`/api/segments/${read.id}`, { data: { version: read.version, text: "This video is sponsored by Marlowe Finishes. Their oil is food-safe once cured: wipe on, wipe off, and that's it." } });
  await presenter.close();
  await page.reload();
  await expect(points).toContainText("✓ Met");
  await expect(page.getByTestId("checks-state")).toContainText("Every promise is kept");
  await shot(page, "sponsor-checks");

  // A review link for the sponsor's contact, read from the dev mailbox by the owner; the guest approves.
  await page.goto(`/c/${channelId}/sponsors`);
  const review = deal.getByRole("form", { name: "Send a review link for Oil read in the spice rack" });
  await review.getByLabel("Sponsor contact's e-mail").fill("tess@marlowe-finishes.example");
  await review.getByRole("button", { name: "Send review link" }).click();
  await expect(deal.getByTestId("deal-review")).toContainText("Review: waiting for the sponsor");
  const owner = await browser.newContext();
  const op = await owner.newPage();
  await new SignInPage(op).signIn("owner@jigboard.example");
  await op.goto(`/c/${channelId}/mailbox`);
  const href = await op.getByTestId("mail-message").filter({ hasText: "Please review: Oil read in the spice rack" }).getByRole("link").first().getAttribute("href");
  await owner.close();
  const guest = await browser.newContext();
  const gp = await guest.newPage();
  await gp.goto(href!);
  await expect(gp.getByRole("article", { name: "Sponsor review" })).toContainText("food-safe once cured");
  await expect(gp.getByRole("article", { name: "Sponsor review" })).not.toContainText("$800");
  await gp.getByRole("button", { name: "Approve" }).click();
  await expect(gp.getByTestId("review-state")).toContainText("You approved this version.");
  await shot(gp, "sponsor-review-guest");
  await guest.close();
  await page.reload();
  await expect(deal.getByTestId("deal-review")).toContainText("Review: approved by the sponsor");
  const thread = deal.getByRole("form", { name: "Reply to Marlowe Finishes" });
  await thread.getByLabel("Reply in the thread").fill("Thank you, Tess.");
  await thread.getByRole("button", { name: "Reply" }).click();
  await expect(deal.getByTestId("deal-review")).toContainText("Priya Castellan: Thank you, Tess.");

  // The invoice goes out through the payments service; the paid webhook comes back.
  await deal.getByRole("button", { name: "Issue invoice" }).click();
  await expect(deal.getByTestId("deal-invoices")).toContainText("Invoice $800.00: sent, not paid yet");
  const { invoices } = (await (await page.request.get(`/api/channels/${channelId}/invoices`)).json()) as { invoices: { dealTitle: string; id: string }[] };
  const pg = await import("pg");
  const client = new pg.default.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  const provider = (await client.query("select provider_id from invoices where id = $1", [invoices.find((i) => i.dealTitle === "Oil read in the spice rack")!.id])).rows[0].provider_id as string;
  await client.end();
  const paid = await page.request.post(`http://127.0.0.1:${process.env.STRIPE_API_PORT}/test/invoices/${provider}/pay`, { headers: { authorization: "Bearer sk_test_local" } });
  expect((await paid.json()).webhookStatus).toBe(200);
  await page.reload();
  await expect(deal.getByTestId("deal-invoices")).toContainText("Invoice $800.00: paid");
  await expect(deal.getByLabel("Status of Oil read in the spice rack")).toHaveValue("paid");
  await expect(page.getByRole("table", { name: "Totals per sponsor" })).toContainText("Marlowe Finishes");
  await shot(page, "sponsors-deal-paid");

  // The editor reads the deal but not its fee.
  const editor = await browser.newContext();
  const ep = await editor.newPage();
  await new SignInPage(ep).signIn("editor@jigboard.example");
  await ep.goto(`/c/${channelId}/sponsors`);
  await expect(ep.getByTestId("deal").filter({ hasText: "Oil read in the spice rack" })).not.toContainText("$800");
  await editor.close();
});
