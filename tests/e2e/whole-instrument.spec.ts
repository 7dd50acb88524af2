/** A whole instrument in the browser: a 500-body, 5,000-contact upload shows its summary and paginated findings, its drawings on request. */
import { expect, test } from "@playwright/test";
import { signInAs } from "./helpers";
import { generate, instrument } from "../support/instruments";

test("a 500-body bench with its mounts: summary and paginated findings at once, drawings on request, a body filter", async ({ page }, info) => {
  test.setTimeout(180_000);
  const layout = { ...instrument(generate(500, "star", 4243, 10)), name: "Larkspur optical bench, whole" };
  await signInAs(page, "designer");
  await page.goto("/projects");
  await page.getByRole("link", { name: "Interferometer breadboard" }).click();
  const name = `Whole bench ${Date.now()}`;
  await page.getByLabel("Layout name").fill(name);
  await page.getByRole("button", { name: "Add layout" }).click();
  await page.getByRole("link", { name }).click();
  await page
    .locator('input[aria-label="Layout file"]')
    .setInputFiles({ name: "bench-500.json", mimeType: "application/json", buffer: Buffer.from(JSON.stringify(layout)) });
  await expect(page.getByTestId("upload-status")).toContainText("Revision 1 stored", { timeout: 120_000 });
  await expect(page.getByTestId("summary")).toContainText("5000");
  // 50 loops listed and more findings: two pages of 50
  const pages = page.getByTestId("findings-pages");
  await expect(pages).toContainText("findings 1–50 of");
  await expect(page.getByTestId("findings-table").locator("tbody tr")).toHaveCount(50);
  await pages.getByRole("button", { name: "next →" }).click();
  await expect(pages).toContainText("page 2 of");
  // the four views of every contact are drawn on request
  await expect(page.locator("svg[data-view]")).toHaveCount(0);
  await page.getByRole("button", { name: "Draw the four views" }).click();
  await expect(page.locator("svg[data-view]")).toHaveCount(4, { timeout: 60_000 });
  await expect(page.locator('svg[data-view="plan"] [data-contact]')).toHaveCount(5000);
  // one mount shown: its ten contacts stand out in every view
  await page.getByLabel("Show body").selectOption("b17");
  await expect(page.locator('svg[data-view] [data-emphasised="true"]')).toHaveCount(40);
  await page.screenshot({ path: info.outputPath("whole-bench.png") });
});
