/** The whole review loop in the browser: upload, findings, comments with a table and math, waiver, new revision, release. */
import { expect, test, type Page } from "@playwright/test";
import path from "node:path";
import { signInAs } from "./helpers";

test.describe.configure({ mode: "serial" });

const layoutName = `Bench mount ${Date.now() % 100000}`;
let layoutUrl = "";

async function openProject(page: Page, name: string) {
  await page.goto("/projects");
  await page.getByRole("link", { name }).click();
  await expect(page.getByRole("heading", { name })).toBeVisible();
}

async function upload(page: Page, file: string) {
  await page.locator('input[aria-label="Layout file"]').setInputFiles(path.join("examples", file));
}

test("designer creates a layout, uploads four feet and sees the over-constrained finding", async ({ page }) => {
  await signInAs(page, "designer");
  await openProject(page, "Interferometer breadboard");
  await page.getByLabel("Layout name").fill(layoutName);
  await page.getByRole("button", { name: "Add layout" }).click();
  await page.getByRole("link", { name: layoutName }).click();
  await expect(page.getByTestId("no-revisions")).toBeVisible();
  layoutUrl = new URL(page.url()).pathname;
  // a refused file: located errors, nothing stored
  await page
    .locator('input[aria-label="Layout file"]')
    .setInputFiles({ name: "broken.csv", mimeType: "text/csv", buffer: Buffer.from("id,x,y,z,nx,ny,nz\nF1,0,zero,0,0,0,1\n") });
  await expect(page.getByTestId("upload-errors")).toContainText("line 2, column 3 (y)");
  await expect(page.getByTestId("no-revisions")).toBeVisible();
  await upload(page, "breadboard-four-feet.json");
  await expect(page.getByTestId("upload-status")).toContainText("Revision 1 stored");
  await expect(page.getByTestId("findings-table")).toContainText("Over-constrained loop: F1 fights F2, F3, F4");
  await expect(page.getByTestId("summary")).toContainText("redundancies");
  await expect(page.getByTestId("layout-drawings")).toBeVisible();
});

test("checker comments with a markdown table and math; a script tag renders inert", async ({ page }) => {
  await signInAs(page, "checker");
  await page.goto(layoutUrl);
  await page
    .getByTestId("findings-table")
    .getByRole("link", { name: /Over-constrained loop/ })
    .click();
  await expect(page.getByTestId("finding-title")).toContainText("Over-constrained loop");
  const text =
    '| warp | change |\n|---|---|\n| 1 µm | 10 N |\n\n$$F = k\\delta/4$$\n\n<script>window.__pwned = true</script><img src=x onerror="window.__pwned=true"> [x](javascript:alert(1)) @dana';
  await page.getByLabel("Comment", { exact: true }).fill(text);
  await expect(page.getByTestId("comment-preview").locator("table")).toBeVisible();
  await page.getByRole("button", { name: "Post comment" }).click();
  const comment = page.getByTestId("comments").locator("li").last();
  await expect(comment.locator("table")).toContainText("10 N");
  await expect(comment.locator(".katex")).toHaveCount(1);
  await expect(comment.locator("script")).toHaveCount(0);
  await expect(comment.locator("img[onerror]")).toHaveCount(0);
  await expect(comment.locator('a[href^="javascript:"]')).toHaveCount(0);
  expect(await page.evaluate(() => (window as unknown as { __pwned?: boolean }).__pwned)).toBeUndefined();
});

test("designer answers; designer can neither waive nor approve (no button, 403)", async ({ page }) => {
  await signInAs(page, "designer");
  await page.goto(layoutUrl);
  await page
    .getByTestId("findings-table")
    .getByRole("link", { name: /Over-constrained loop/ })
    .click();
  await page.getByLabel("Comment", { exact: true }).fill("Moving to three seats in revision 2.");
  await page.getByRole("button", { name: "Post comment" }).click();
  await expect(page.getByTestId("comments")).toContainText("Moving to three seats");
  await expect(page.getByRole("button", { name: "Waive finding" })).toHaveCount(0);
  const threadId = Number(new URL(page.url()).pathname.split("/").pop());
  const res = await page.request.post(`/api/threads/${threadId}/status`, { data: { action: "waive", reason: "designer tries to waive", version: 1 } });
  expect(res.status()).toBe(403);
});

test("checker waives one finding with a reason", async ({ page }) => {
  await signInAs(page, "checker");
  await page.goto(layoutUrl);
  await page
    .getByTestId("findings-table")
    .getByRole("link", { name: /The count 6N − m = 2 hides/ })
    .click();
  await page.getByLabel(/Justification/).fill("The count is explained by the four feet; tracked in the loop finding.");
  await page.getByRole("button", { name: "Waive finding" }).click();
  await expect(page.getByTestId("waiver")).toContainText("tracked in the loop finding");
  await expect(page.getByTestId("finding-history")).toContainText("waive");
});

test("designer uploads three seats: the loop resolves; requests release", async ({ page }) => {
  await signInAs(page, "designer");
  await page.goto(layoutUrl);
  await upload(page, "breadboard-three-seats.json");
  await expect(page.getByTestId("upload-status")).toContainText("Revision 2 stored");
  await expect(page.getByTestId("findings-table")).not.toContainText("Over-constrained loop");
  await expect(page.getByTestId("revision-diff")).toContainText("Over-constrained loop");
  // an irreversible step asks first: Escape cancels, nothing is requested
  await page.getByRole("button", { name: "Request release of r2" }).click();
  await expect(page.getByRole("dialog", { name: "Request release of revision 2?" })).toBeVisible();
  await page.keyboard.press("Escape");
  await expect(page.getByTestId("release-state")).toContainText("Not requested");
  // request, withdraw (until approved), request again — each confirmed
  await page.getByRole("button", { name: "Request release of r2" }).click();
  await page.getByRole("dialog").getByRole("button", { name: "Request release" }).click();
  await expect(page.getByTestId("release-state")).toContainText("Release requested by Dana Reyes");
  await page.getByRole("button", { name: "Withdraw release request" }).click();
  await page.getByRole("dialog").getByRole("button", { name: "Withdraw request" }).click();
  await expect(page.getByTestId("release-state")).toContainText("Not requested");
  await expect(page.getByTestId("history")).toContainText("withdrew the release request of revision 2");
  await page.getByRole("button", { name: "Request release of r2" }).click();
  await page.getByRole("dialog").getByRole("button", { name: "Request release" }).click();
  await expect(page.getByTestId("release-state")).toContainText("Release requested by Dana Reyes");
  // a designer cannot approve: no button, and the API says 403
  await expect(page.getByRole("button", { name: /Approve release/ })).toHaveCount(0);
  const rev = await (await page.request.get(`/api${layoutUrl}`)).json();
  const res = await page.request.post(`/api/revisions/${rev.revisions[1].id}/release`, { data: { action: "approve" } });
  expect(res.status()).toBe(403);
});

test("checker approves the release; the revision is read-only and its report downloads", async ({ page }) => {
  await signInAs(page, "checker");
  await page.goto(layoutUrl);
  // before approval the printable report is a draft and claims no approval
  const before = await (await page.request.get(`/api${layoutUrl}`)).json();
  const draft = await (await page.request.get(`/api/revisions/${before.revisions[1].id}/report?format=md`)).text();
  expect(draft).toMatch(/^# DRAFT, not approved/);
  expect(draft).not.toMatch(/Approved by/);
  await page.getByRole("button", { name: "Approve release of r2" }).click();
  await expect(page.getByRole("dialog", { name: "Release revision 2?" })).toContainText("Releasing is final");
  await page.getByRole("dialog").getByRole("button", { name: "Approve and release" }).click();
  await expect(page.getByTestId("release-state")).toContainText("Released by Chen Okafor");
  const rev = await (await page.request.get(`/api${layoutUrl}`)).json();
  const md = await page.request.get(`/api/revisions/${rev.revisions[1].id}/report?format=md`);
  expect(await md.text()).toMatch(/Release report — .*revision 2[\s\S]*Approved by Chen Okafor/);
});
