/** Administration in the browser: a manager assigns a checker; an admin adds and deactivates a user, who then cannot sign in. */
import { expect, test } from "@playwright/test";
import { signInAs } from "./helpers";

test("a manager assigns and changes the project's checker on the project page; the change is recorded", async ({ page }) => {
  await signInAs(page, "manager");
  await page.goto("/projects");
  await page.getByRole("link", { name: "Interferometer breadboard" }).click();
  const control = page.getByTestId("checker-control");
  await control.getByLabel("Checker who approves releases").selectOption({ label: "not assigned (any checker)" });
  await control.getByRole("button", { name: "Save checker" }).click();
  await expect(page.getByTestId("checker-history")).toContainText("to not assigned");
  await control.getByLabel("Checker who approves releases").selectOption({ label: "Chen Okafor" });
  await control.getByRole("button", { name: "Save checker" }).click();
  await expect(page.getByTestId("checker-history")).toContainText("from not assigned to Chen Okafor");
});

test("an admin adds a user, who signs in; once deactivated they cannot", async ({ page, browser }) => {
  const email = `pat.${Date.now()}@larkspur.example`;
  await signInAs(page, "admin");
  await page.goto("/admin");
  const form = page.getByRole("form", { name: "Add a user" });
  await form.getByLabel("Name").fill("Pat Lindqvist");
  await form.getByLabel("E-mail").fill(email);
  await form.getByLabel(/First password/).fill("designer-pat-01");
  await form.getByLabel("Role").selectOption("designer");
  await form.getByRole("button", { name: "Add user" }).click();
  await expect(page.getByTestId("user-table")).toContainText(email);

  const other = await browser.newPage();
  const signIn = async () => {
    await other.goto("/signin");
    await other.getByLabel("E-mail").fill(email);
    await other.getByLabel("Password").fill("designer-pat-01");
    await other.getByRole("button", { name: "Sign in" }).click();
  };
  await signIn();
  await expect(other.getByTestId("whoami")).toContainText("Pat Lindqvist");

  await page.getByRole("button", { name: "Deactivate Pat Lindqvist" }).click();
  await page.getByRole("dialog").getByRole("button", { name: "Deactivate" }).click();
  await expect(page.getByTestId("user-table").locator("tr", { hasText: email })).toContainText("deactivated");
  // the open session no longer reaches the API, and a fresh sign-in is refused
  expect((await other.request.get("/api/projects")).status()).toBe(401);
  await other.context().clearCookies();
  await signIn();
  await expect(other.getByRole("alert")).toBeVisible();
  await expect(other.getByTestId("whoami")).toHaveCount(0);
});
