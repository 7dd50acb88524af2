/** Project rule overrides in the browser: an administrator sets and clears one with a reason; others read them. */
import { expect, test } from "@playwright/test";
import { signInAs } from "./helpers";

test("an administrator overrides a rule's severity for one project, everyone sees it with the reason, and clears it", async ({ page, browser }) => {
  await signInAs(page, "admin");
  await page.goto("/projects");
  await page.getByRole("link", { name: "Two-blade flexure stage" }).click();
  const section = page.locator("#rule-overrides");
  await expect(section.getByTestId("overrides-none")).toBeVisible();

  const form = page.getByRole("form", { name: "Change a rule override" });
  await form.getByLabel("Rule").selectOption("coupling-geometry");
  await form.getByLabel("Severity in this project").selectOption("warning");
  await form.getByLabel("Reason (kept in the history)").fill("short");
  await form.getByRole("button", { name: "Save override" }).click();
  await expect(form.getByText("Give the reason in at least 10 characters.")).toBeVisible();

  // options that the rule does not know are refused with the known names
  await form.getByLabel("Options (JSON)").fill('{"angel": 5}');
  await form.getByLabel("Reason (kept in the history)").fill("Stage guidance vees are ground in one setup.");
  await form.getByRole("button", { name: "Save override" }).click();
  await expect(form.getByRole("alert")).toContainText('has no option "angel"');
  await form.getByLabel("Options (JSON)").fill("");
  await form.getByRole("button", { name: "Save override" }).click();
  const table = section.getByTestId("overrides-table");
  await expect(table).toContainText("coupling-geometry");
  await expect(table).toContainText("warning");
  await expect(table).toContainText("Stage guidance vees are ground in one setup.");
  await expect(table).toContainText("Ari");

  // a designer reads the override but gets no form
  const other = await browser.newPage();
  await signInAs(other, "designer");
  await other.goto(page.url());
  await expect(other.locator("#rule-overrides").getByTestId("overrides-table")).toContainText("coupling-geometry");
  await expect(other.getByRole("form", { name: "Change a rule override" })).toHaveCount(0);
  await other.close();

  await form.getByLabel("Reason (kept in the history)").fill("Back to the rule's own severity after the demo.");
  await form.getByRole("button", { name: "Clear override of coupling-geometry" }).click();
  await expect(section.getByTestId("overrides-none")).toBeVisible();
  await section.getByText(/History \(2 changes\)/).click();
  await expect(section.getByTestId("overrides-history")).toContainText("cleared");
});
