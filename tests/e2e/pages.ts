import { expect, type Page, type Locator } from "@playwright/test";
import path from "node:path";

export const SHOTS = path.resolve(process.cwd(), "tests", ".artifacts", "screenshots");
export const DEMO_PASSWORD = "jigboard-demo";

export class SignInPage {
  constructor(private page: Page) {}
  async signIn(email: string, password = DEMO_PASSWORD) {
    await this.page.goto("/sign-in");
    await this.page.getByLabel("E-mail").fill(email);
    await this.page.getByLabel("Password").fill(password);
    await this.page.getByRole("button", { name: "Sign in" }).click();
    await this.page.waitForURL(/\/c\/[0-9a-f-]+$/);
  }
}

export class BoardPage {
  constructor(private page: Page) {}
  column(label: string): Locator {
    return this.page.locator("section", { has: this.page.getByRole("heading", { name: new RegExp(label) }) });
  }
  card(title: string): Locator {
    return this.page.getByTestId("episode-card").filter({ hasText: title });
  }
  async moveWithMenu(title: string, stageLabel: string) {
    await this.card(title).getByRole("button", { name: "Move to…" }).click();
    // The menu opens in a portal, outside the card.
    await this.page.getByRole("menu").getByRole("menuitem", { name: new RegExp(`${stageLabel}$`) }).click();
  }
  status(): Locator {
    return this.page.getByTestId("board-status");
  }
}

export async function shot(page: Page, name: string) {
  await page.screenshot({ path: path.join(SHOTS, `${name}.png`), fullPage: true });
}

export { expect };
