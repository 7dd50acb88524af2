/** Sign-in per role, the projects page, project creation by a manager, refusal for a designer, signed-out redirect. */
import { expect, test } from "@playwright/test";
import { signInAs } from "./helpers";

test("a signed-out visit redirects to sign-in", async ({ page }) => {
  await page.goto("/projects");
  await expect(page).toHaveURL(/\/signin\?callbackUrl=%2Fprojects/);
  await expect(page.getByRole("heading", { name: "Sign in" })).toBeVisible();
});

test("a wrong password is answered with a clear message", async ({ page }) => {
  await page.goto("/signin");
  await page.getByLabel("E-mail").fill("dana@larkspur.example");
  await page.getByLabel("Password").fill("not-the-password");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("alert").filter({ hasText: "do not match" })).toBeVisible();
  await expect(page.getByLabel("E-mail")).toHaveValue("dana@larkspur.example");
});

for (const role of ["designer", "checker", "manager", "admin"] as const) {
  test(`${role} signs in and sees the projects page`, async ({ page }) => {
    await signInAs(page, role);
    await expect(page.getByRole("heading", { name: "Projects" })).toBeVisible();
    await expect(page.getByTestId("project-list")).toContainText("Interferometer breadboard");
    const createButton = page.getByRole("button", { name: "Create project" });
    if (role === "manager") await expect(createButton).toBeVisible();
    else await expect(createButton).toHaveCount(0);
  });
}

test("a manager creates a project; validation errors appear beside the field", async ({ page }) => {
  await signInAs(page, "manager");
  await page.getByLabel("Name").fill("x");
  await page.getByRole("button", { name: "Create project" }).click();
  await expect(page.locator("#project-name-error")).toContainText("at least 3 characters");
  await page.getByLabel("Name").fill("Cryostat cold-plate mount");
  await page.getByLabel("Description").fill("Three bipods under a cold plate.");
  await page.getByRole("button", { name: "Create project" }).click();
  await expect(page.getByTestId("project-list")).toContainText("Cryostat cold-plate mount");
});

test("a designer cannot create a project: no button and 403 from the API", async ({ page }) => {
  await signInAs(page, "designer");
  await expect(page.getByRole("button", { name: "Create project" })).toHaveCount(0);
  const res = await page.request.post("/api/projects", { data: { name: "Sneaky project", description: "" } });
  expect(res.status()).toBe(403);
});

test("the API answers 401 to a signed-out caller", async ({ request }) => {
  const res = await request.get("/api/projects");
  expect(res.status()).toBe(401);
});

test("signing out returns to sign-in and the projects page is closed again", async ({ page }) => {
  await signInAs(page, "checker");
  await page.getByRole("link", { name: "Sign out" }).click();
  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page).toHaveURL(/\/signin/);
  await page.goto("/projects");
  await expect(page).toHaveURL(/\/signin/);
});
