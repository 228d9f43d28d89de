import { test, type Page } from "@playwright/test";
import { SignInPage, expect, shot } from "./pages";

/**
 * Long lists must stay responsive while someone types and edits. A render
 * loop shows up as a stream of DOM mutations with nobody touching the page,
 * so each check counts the mutations seen in a quiet second after the edit.
 */
async function quietMutations(page: Page, ms = 1000): Promise<number> {
  return page.evaluate(
    (ms) =>
      new Promise<number>((resolve) => {
        let n = 0;
        const o = new MutationObserver((list) => (n += list.length));
        o.observe(document.body, { subtree: true, childList: true, attributes: true, characterData: true });
        setTimeout(() => {
          o.disconnect();
          resolve(n);
        }, ms);
      }),
    ms,
  );
}

/** The page answers a trivial script promptly (a locked main thread would time out here). */
async function responsive(page: Page) {
  const t0 = Date.now();
  await page.evaluate(() => 1 + 1);
  expect(Date.now() - t0).toBeLessThan(2000);
  // A quiet page changes nothing; a settled table may repaint a handful of nodes.
  expect(await quietMutations(page)).toBeLessThan(40);
}

async function setup(page: Page, title: string) {
  await new SignInPage(page).signIn("presenter@jigboard.example");
  const channelId = page.url().split("/c/")[1]!;
  const ep = (await (await page.request.post(`/api/channels/${channelId}/episodes`, { data: { title: `${title} ${Date.now().toString(36)}`, stage: "planning", frameRate: "25" } })).json()).episode as { id: string };
  const step = (await (await page.request.post(`/api/episodes/${ep.id}/steps`, { data: { title: "Rip the slats", activeMinutes: 40 } })).json()).step as { id: string };
  return { base: `/c/${channelId}/episodes/${ep.id}`, episodeId: ep.id, stepId: step.id };
}

test("a shot list of 55 shots stays responsive while finding, adding and changing status", async ({ page }) => {
  test.setTimeout(120_000);
  const { base, episodeId, stepId } = await setup(page, "Slatted bench");
  for (let i = 0; i < 55; i++) {
    const r = await page.request.post(`/api/episodes/${episodeId}/shots`, { data: { kind: i % 3 ? "broll" : "to_camera", description: `Slat ${i} through the saw`, stepId: i % 2 ? stepId : null } });
    expect(r.status()).toBe(201);
  }
  await page.goto(`${base}/shots`);
  await expect(page.getByTestId("shot-row")).toHaveCount(55);
  await responsive(page);

  await page.getByLabel("Find").pressSequentially("slat 4", { delay: 20 });
  await expect(page.getByTestId("shot-row")).toHaveCount(11); // 4 and 40-49
  await expect(page.getByLabel("Find")).toHaveValue("slat 4");
  await responsive(page);
  await page.getByLabel("Find").fill("");
  await expect(page.getByTestId("shot-row")).toHaveCount(55);

  const add = page.getByRole("form", { name: "Add a shot" });
  await add.getByLabel("What it shows").pressSequentially("Offcut pile at the end of the day", { delay: 10 });
  await expect(add.getByLabel("What it shows")).toHaveValue("Offcut pile at the end of the day");
  await responsive(page);
  await add.getByRole("button", { name: "Add shot" }).click();
  await expect(page.getByTestId("shot-row")).toHaveCount(56);

  const row = page.getByTestId("shot-row").filter({ hasText: "Slat 7 through the saw" });
  await row.getByLabel("Status of Slat 7 through the saw").selectOption("captured");
  await expect(row).toHaveAttribute("data-status", "captured");
  await responsive(page);
  await shot(page, "shot-list-long");
});

test("a cut list of 55 parts and a script of 55 segments stay responsive while editing", async ({ page }) => {
  test.setTimeout(120_000);
  const { base, episodeId } = await setup(page, "Long lists");
  for (let i = 0; i < 55; i++) {
    expect((await page.request.post(`/api/episodes/${episodeId}/materials`, { data: { partName: `Slat ${i}`, material: "Ash", thickness: "3/4", width: "2", length: "36" } })).status()).toBe(201);
    expect((await page.request.post(`/api/episodes/${episodeId}/script`, { data: { kind: "voice_over", text: `Slat ${i} goes through the saw with the fence at two inches.` } })).status()).toBe(201);
  }

  await page.goto(`${base}/cut-list`);
  await expect(page.getByTestId("cut-list-table").locator("tbody tr")).toHaveCount(55);
  await responsive(page);
  await page.getByRole("button", { name: "Edit part name of Slat 3:" }).click();
  const input = page.getByRole("textbox", { name: "part name of Slat 3", exact: true });
  await input.pressSequentially(" (left)", { delay: 20 });
  await expect(input).toHaveValue("Slat 3 (left)");
  await input.press("Enter");
  await expect(page.getByTestId("cut-list-table")).toContainText("Slat 3 (left)");
  await responsive(page);

  await page.goto(`${base}/script`);
  await expect(page.getByTestId("segment")).toHaveCount(55);
  await responsive(page);
  const box = page.getByRole("textbox", { name: "Segment 20 text" });
  await box.click();
  await box.press("End");
  await box.pressSequentially(" Then sand.", { delay: 20 });
  await expect(box).toHaveValue(/Then sand\.$/);
  await expect(page.getByTestId("script-save-state")).toHaveText("All changes saved");
  await responsive(page);
});
