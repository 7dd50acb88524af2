/** Drawing views: four views on the layout page; a finding's page emphasises its contacts; a screenshot is kept. */
import { expect, test } from "@playwright/test";
import { signInAs } from "./helpers";

test("a finding page draws four views with its contacts emphasised", async ({ page }, info) => {
  await signInAs(page, "manager");
  await page.goto("/projects");
  await page.getByRole("link", { name: "Two-blade flexure stage" }).click();
  await page.getByRole("link", { name: "Stage guidance" }).click();
  await expect(page.locator("svg[data-view]")).toHaveCount(4);
  await expect(page.getByTestId("drawing-legend")).toBeVisible();
  // the stage's one free motion (translation along x) is drawn in every view
  await expect(page.locator('svg[data-view] [data-motion="0"]')).toHaveCount(4);
  await page.getByTestId("findings-table").getByRole("link", { name: /Over-constrained loop/ }).click();
  await expect(page.locator("svg[data-view]")).toHaveCount(4);
  // four involved contacts, in each of four views
  await expect(page.locator('[data-emphasised="true"]')).toHaveCount(16);
  await expect(page.locator('[data-emphasised="false"]')).toHaveCount(8);
  // keyboard focus on a contact shows its numbers
  await page.locator('svg[data-view="plan"] [data-contact="A-z1"]').focus();
  await expect(page.getByTestId("contact-info")).toContainText("A-z1");
  await expect(page.getByTestId("contact-info")).toContainText("mm");
  await page.screenshot({ path: info.outputPath("finding-drawings.png"), fullPage: true });
});

test("the printable report carries the same four drawing views and the report text", async ({ page }) => {
  await signInAs(page, "checker");
  await page.goto("/projects");
  await page.getByRole("link", { name: "Two-blade flexure stage" }).click();
  await page.getByRole("link", { name: "Stage guidance" }).click();
  await page.getByRole("link", { name: "Printable report" }).click();
  await expect(page.getByTestId("printable-report")).toContainText("Release report");
  await expect(page.locator("svg[data-view]")).toHaveCount(4);
  await expect(page.getByTestId("printable-report")).toContainText("Waived by Chen Okafor");
  await page.emulateMedia({ media: "print" });
  await expect(page.getByRole("button", { name: "Print" })).toBeHidden();
});
