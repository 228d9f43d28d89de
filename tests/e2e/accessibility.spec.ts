import { test, type Page } from "@playwright/test";
import AxeBuilder from "@axe-core/playwright";
import { SignInPage, expect, shot } from "./pages";

/**
 * axe-core (WCAG 2.0-2.2 A and AA rules) on every main page, at a laptop
 * width and at a 390 px phone width with touch: no serious or critical
 * violation. Each page is also screenshotted at both widths to look at.
 */
const WIDTHS = [
  { name: "desktop", viewport: { width: 1440, height: 900 }, touch: false },
  { name: "phone", viewport: { width: 390, height: 844 }, touch: true },
] as const;

async function audit(page: Page, label: string, found: string[]) {
  const r = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa"]).analyze();
  const bad = r.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  for (const v of bad) found.push(`${label}: ${v.id} (${v.impact}): ${v.help}\n    ${v.nodes.slice(0, 4).map((n) => n.target.join(" ")).join("\n    ")}`);
}

for (const w of WIDTHS) {
  test(`main pages have no serious accessibility violations (${w.name})`, async ({ browser }) => {
    test.setTimeout(180_000);
    const ctx = await browser.newContext({ viewport: w.viewport, hasTouch: w.touch, isMobile: w.touch });
    const page = await ctx.newPage();
    // The live-update stream stays open for ever, so "network idle" would never come: these pages are audited without it.
    await page.route(/\/api\/channels\/[^/]+\/live/, (r) => r.fulfill({ status: 204, body: "" }));
    const found: string[] = [];

    for (const path of ["/sign-in", "/forgot-password"]) {
      await page.goto(path);
      await audit(page, path, found);
    }
    await shot(page, `a11y-forgot-${w.name}`);

    await new SignInPage(page).signIn("owner@jigboard.example");
    const channelId = page.url().split("/c/")[1]!;
    const episodes = (await (await page.request.get(`/api/channels/${channelId}/episodes`)).json()).episodes as { id: string; title: string }[];
    const bench = episodes.find((e) => e.title.startsWith("Outdoor bench"))!;
    const clips = (await (await page.request.get(`/api/episodes/${bench.id}/clips`)).json()).clips as { id: string }[];
    const c = `/c/${channelId}`;
    const e = `${c}/episodes/${bench.id}`;
    const pages: [string, string][] = [
      ["board", c],
      ["tools", `${c}/tools`],
      ["people", `${c}/members`],
      ["settings", `${c}/settings`],
      ["mailbox", `${c}/mailbox`],
      ["episode", e],
      ["plan", `${e}/plan`],
      ["cut-list", `${e}/cut-list`],
      ["script", `${e}/script`],
      ["read-through", `${e}/script/read`],
      ["shots", `${e}/shots`],
      ["footage", `${e}/footage`],
      ["coverage", `${e}/coverage`],
    ];
    if (clips[0]) pages.push(["clip", `${e}/footage/${clips[0].id}`]);
    const table = episodes.find((x) => x.title.startsWith("Walnut side table"))!;
    const days = (await (await page.request.get(`/api/channels/${channelId}/shoot-days?from=2026-12-12&to=2026-12-12`)).json()).shootDays as { id: string }[];
    pages.push(["shoot-days", `${c}/shoot-days`], ["schedule", `${c}/episodes/${table.id}/schedule`], ["sponsors", `${c}/sponsors`], ["sponsor-checks", `${c}/episodes/${table.id}/sponsors`], ["publish", `${c}/episodes/${table.id}/publish`], ["overview", `${c}/overview`], ["workshop", `${c}/workshop/${table.id}`]);
    if (days[0]) pages.push(["call-sheet", `${c}/shoot-days/${days[0].id}/call-sheet`]);
    for (const [name, url] of pages) {
      await page.goto(url);
      await page.waitForLoadState("networkidle");
      await audit(page, name, found);
      await shot(page, `a11y-${name}-${w.name}`);
    }

    if (w.touch) {
      // Touch screens: the controls a person taps are at least 44 px tall (common practice on touch platforms; WCAG 2.5.8 asks 24 px).
      for (const url of [c, `${e}/plan`, `${e}/shots`]) {
        await page.goto(url);
        await page.waitForLoadState("networkidle");
        const small = await page.evaluate(() =>
          [...document.querySelectorAll<HTMLElement>("header a, header button, main button, main select, main input:not([type=hidden]):not(.sr-only)")]
            // A checkbox or radio inside its label is tapped through the whole label.
            .map((el) => ({ el, target: (el.matches("input[type=checkbox], input[type=radio]") && el.closest("label")) || el }))
            .filter(({ el, target }) => {
              const r = target.getBoundingClientRect();
              return r.width > 0 && r.height > 0 && getComputedStyle(el).visibility !== "hidden" && (r.height < 44 || r.width < 44);
            })
            .map(({ el, target }) => `${el.tagName.toLowerCase()} "${(el.getAttribute("aria-label") ?? el.textContent ?? "").trim().slice(0, 40)}" ${Math.round(target.getBoundingClientRect().width)}×${Math.round(target.getBoundingClientRect().height)}`),
        );
        for (const s of small) found.push(`${url}: target under 44 px: ${s}`);
      }
    }
    await ctx.close();
    expect(found.join("\n")).toBe("");
  });
}
