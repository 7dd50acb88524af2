/** Phone and desk widths: the main pages fit 390 px without sideways scrolling, the menu reaches every page; screenshots are kept as artifacts. */
import { expect, test, type Page } from "@playwright/test";
import { signInAs } from "./helpers";

const overflow = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);

async function mainPages(page: Page): Promise<[string, string][]> {
  const projects = await (await page.request.get("/api/projects")).json();
  const plate = projects.projects.find((p: { name: string }) => p.name === "Detachable instrument plate");
  const layouts = (await (await page.request.get(`/api/projects/${plate.id}`)).json()).layouts;
  const detail = await (await page.request.get(`/api/layouts/${layouts[0].id}`)).json();
  return [
    ["projects", "/projects"],
    ["project", `/projects/${plate.id}`],
    ["layout", `/layouts/${layouts[0].id}`],
    ["finding", `/findings/${detail.threads[0].id}`],
    ["dashboard", "/dashboard"],
    ["settings", "/settings"],
  ];
}

test("at 390 px every main page fits the width and the menu reaches the other pages", async ({ page }, info) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await signInAs(page, "manager");
  for (const [name, url] of await mainPages(page)) {
    await page.goto(url);
    await expect(page.locator("main")).toBeVisible();
    await page.waitForLoadState("networkidle");
    expect(await overflow(page), `${name} scrolls sideways`).toBeLessThanOrEqual(1);
    await page.screenshot({ path: info.outputPath(`phone-${name}.png`), fullPage: true });
  }
  await page.getByTestId("phone-menu").getByText("Menu").click();
  await page.getByRole("navigation", { name: "Main (menu)" }).getByRole("link", { name: "Settings" }).click();
  await expect(page).toHaveURL(/\/settings/);
});

test("at 1440 px the main pages keep their screenshots as artifacts", async ({ page }, info) => {
  await page.setViewportSize({ width: 1440, height: 900 });
  await signInAs(page, "checker");
  for (const [name, url] of await mainPages(page)) {
    await page.goto(url);
    await page.waitForLoadState("networkidle");
    expect(await overflow(page), `${name} scrolls sideways`).toBeLessThanOrEqual(1);
    await page.screenshot({ path: info.outputPath(`desk-${name}.png`), fullPage: true });
  }
});
