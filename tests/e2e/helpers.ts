/** Browser-test helpers: sign in as a demo user. */
import { expect, type Page } from "@playwright/test";
import { demoUsers } from "../../db/seeds/01_users";

export type DemoRole = (typeof demoUsers)[number]["role"];

/** Signs in through the sign-in form as the demo user of a role. */
export async function signInAs(page: Page, role: DemoRole): Promise<void> {
  const user = demoUsers.find((u) => u.role === role)!;
  await page.goto("/signin");
  await page.getByLabel("E-mail").fill(user.email);
  await page.getByLabel("Password").fill(user.password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByTestId("whoami")).toContainText(user.name);
}
