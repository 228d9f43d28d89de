import { test } from "@playwright/test";
import { SignInPage, expect, shot } from "./pages";

test("a bad setting is named by its label, and roles that cannot change settings read them as text", async ({ browser }) => {
  const ctx = await browser.newContext();
  const page = await ctx.newPage();
  await new SignInPage(page).signIn("owner@jigboard.example");
  const channelId = page.url().split("/c/")[1]!;
  await page.goto(`/c/${channelId}/settings`);
  const form = page.getByRole("form", { name: "Channel settings" });
  await form.getByLabel("B-roll gap: voice-over bare for more than (seconds)").fill("-1");
  await form.getByRole("button", { name: "Save settings" }).click();
  const notice = form.getByRole("alert").first();
  await expect(notice).toContainText("B-roll gap: cannot be negative");
  await expect(form).not.toContainText("brollGapMs");
  await shot(page, "settings-error");
  await ctx.close();

  const editorCtx = await browser.newContext();
  const editor = await editorCtx.newPage();
  await new SignInPage(editor).signIn("editor@jigboard.example");
  await editor.goto(`/c/${channelId}/settings`);
  await expect(editor.getByTestId("settings-read-only")).toContainText("Only the owner changes channel settings.");
  await expect(editor.getByRole("textbox")).toHaveCount(0);
  // The episode overview reads as facts, not as a locked form.
  const eps = (await (await editor.request.get(`/api/channels/${channelId}/episodes`)).json()).episodes as { id: string; title: string }[];
  await editor.goto(`/c/${channelId}/episodes/${eps[0]!.id}`);
  await expect(editor.getByTestId("episode-facts")).toContainText(eps[0]!.title);
  await expect(editor.getByTestId("episode-facts").getByRole("textbox")).toHaveCount(0);
  await editorCtx.close();
});
