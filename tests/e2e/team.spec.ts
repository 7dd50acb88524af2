/** Team tools end to end: mention mail through the fake SMTP server, the CAD shell snippet with a token, the PDF report, the dashboard. */
import { execFileSync, spawnSync } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import { expect, test } from "@playwright/test";
import { extractText, getDocumentProxy } from "unpdf";
import { signInAs } from "./helpers";
import { winAnsi } from "../../lib/report/pdf";

const captured = () => {
  const file = process.env.MAIL_CAPTURE_FILE ?? ".data/mail/test-captured.jsonl";
  return existsSync(file)
    ? readFileSync(file, "utf8")
        .split("\n")
        .filter(Boolean)
        .map((l) => JSON.parse(l))
    : [];
};

test("an @mention sends a mail that the fake SMTP server captures, and the admin page lists it", async ({ page }) => {
  await signInAs(page, "checker");
  await page.goto("/projects");
  await page.getByRole("link", { name: "Detachable instrument plate" }).click();
  await page.getByRole("link", { name: "Plate coupling" }).click();
  await page
    .getByTestId("findings-table")
    .getByRole("link", { name: /inverted: flat lifts off/ })
    .click();
  const marker = `preload check ${Date.now()}`;
  await page.getByLabel("Comment", { exact: true }).fill(`@dana please add a ${marker}.`);
  await page.getByRole("button", { name: "Post comment" }).click();
  await expect(page.getByTestId("comments")).toContainText(marker);
  // the mention stands out in the thread
  await expect(page.getByTestId("comments").locator(".mention", { hasText: "@dana" }).first()).toBeVisible();
  await expect
    .poll(() => captured().find((m) => m.to.includes("dana@larkspur.example") && /mentioned you/.test(m.subject) && m.text.includes(marker)), {
      timeout: 15_000,
    })
    .toBeTruthy();
  const mail = captured().find((m) => m.text.includes(marker));
  expect(mail.text).toMatch(/http:\/\/localhost:3100\/findings\/\d+/);
  await page.goto("/signout");
  await page.getByRole("button", { name: "Sign out" }).click();
  // wait for the sign-out redirect to land before the next navigation (it raced page.goto before)
  await page.waitForURL((u) => !u.pathname.startsWith("/signout"));
  await signInAs(page, "admin");
  await page.goto("/admin");
  await expect(page.getByTestId("captured-mail")).toContainText(marker);
  await expect(page.getByTestId("outbox")).toContainText("mention");
});

test("the CAD shell snippet posts with a token: 201 for a good file, 422 with locations for a bad one", async ({ page }) => {
  test.skip(spawnSync("curl", ["--version"]).status !== 0, "curl is installed by the test command; not found here");
  await signInAs(page, "designer");
  const created = await page.request.post("/api/tokens", { data: { name: "e2e script" } });
  expect(created.status()).toBe(201);
  const { token } = await created.json();
  const layouts = await (await page.request.get("/api/projects/1")).json();
  const layoutId = layouts.layouts[0].id;
  const env = { ...process.env, SIXFOLD_TOKEN: token, SIXFOLD_URL: "http://localhost:3100" };
  const good = spawnSync("sh", ["public/sixfold-post.sh", String(layoutId), "examples/breadboard-three-seats.json"], { env, encoding: "utf8" });
  expect(good.status, good.stderr).toBe(0);
  expect(good.stdout).toMatch(/accepted, no error findings/);
  const report = JSON.parse(good.stdout.split("\n").slice(1).join("\n"));
  expect(report.counts).toMatchObject({ rank: 6, freedoms: 0 });
  expect(report.revision.url).toMatch(/\/layouts\/\d+\?revision=\d+/);
  const withErrors = spawnSync("sh", ["public/sixfold-post.sh", String(layoutId), "examples/breadboard-four-feet.xml"], { env, encoding: "utf8" });
  expect(withErrors.status).toBe(1);
  execFileSync("sh", ["-c", "printf 'id,x,y,z,nx,ny,nz\\nA,0,0,0,0,0,0\\n' > /tmp/sixfold-bad.csv"]);
  const bad = spawnSync("sh", ["public/sixfold-post.sh", String(layoutId), "/tmp/sixfold-bad.csv"], { env, encoding: "utf8" });
  expect(bad.status).toBe(2);
  expect(bad.stderr).toMatch(/line 2, columns 5–7 \(nx, ny, nz\)/);
  // without a valid token: 401; the findings endpoint answers the open ones
  const denied = spawnSync("sh", ["public/sixfold-post.sh", String(layoutId), "examples/breadboard-three-seats.json"], {
    env: { ...env, SIXFOLD_TOKEN: "sfx_wrongwrongwrongwrongwrong" },
    encoding: "utf8",
  });
  expect(denied.status).toBe(3);
  expect(denied.stderr).toMatch(/HTTP 401/);
  const open = await page.request.get(`/api/v1/layouts/${layoutId}/findings?status=open`, { headers: { authorization: `Bearer ${token}` } });
  expect(open.status()).toBe(200);
  expect((await open.json()).findings.every((f: { status: string }) => f.status === "open" || f.status === "reopened")).toBe(true);
});

test("the PDF report of a released revision downloads with its pages and finding titles", async ({ page }) => {
  await signInAs(page, "manager");
  const project = (await (await page.request.get("/api/projects")).json()).projects.find((p: { name: string }) => p.name === "Two-blade flexure stage");
  const layout = (await (await page.request.get(`/api/projects/${project.id}`)).json()).layouts[0];
  const detail = await (await page.request.get(`/api/layouts/${layout.id}`)).json();
  const rev = detail.revisions[detail.revisions.length - 1];
  const res = await page.request.get(`/api/revisions/${rev.id}/report?format=pdf`);
  expect(res.status()).toBe(200);
  expect(res.headers()["content-type"]).toBe("application/pdf");
  const pdf = await getDocumentProxy(new Uint8Array(await res.body()));
  const { totalPages, text } = await extractText(pdf, { mergePages: true });
  expect(totalPages).toBeGreaterThanOrEqual(2);
  const findings = (await (await page.request.get(`/api/revisions/${rev.id}`)).json()).revision.findings;
  // the PDF's standard fonts spell some characters out (winAnsi); µ may come back as Greek mu
  const norm = (t: string) => t.replace(/[µμ]/g, "u").replace(/\s+/g, " ");
  for (const f of findings) expect(norm(text)).toContain(norm(winAnsi(f.title)).slice(0, 30));
  expect(text).toMatch(/Waived by Chen Okafor/);
  expect(text).toMatch(/Approved by Chen Okafor/);
  expect(text).toMatch(/licensed engineering practice/);
  // the four drawing views of the screen, captioned as there, with the drawing legend
  expect(text).toMatch(/Drawing views/);
  for (const v of ["Plan", "Front", "Side", "Axonometric"]) expect(text).toContain(`${v} . `);
  expect(text).toMatch(/body outline: the convex hull/);
});

test("the manager's dashboard shows open findings by project and severity, the trend and the blocked layout", async ({ page }) => {
  await signInAs(page, "manager");
  await page.goto("/dashboard");
  await expect(page.getByTestId("dashboard-table")).toContainText("Detachable instrument plate");
  await expect(page.getByTestId("trend-chart")).toBeVisible();
  await expect(page.getByTestId("layouts-blocked")).toContainText("Plate coupling");
  // four blockers: three shown, then "1 more"
  await expect(page.getByTestId("blocked-more")).toContainText("1 more");
  // a filter goes into the address and applies to every panel; the address alone restores it
  await page.getByLabel("Rule").selectOption("seat-lift-off");
  await expect(page).toHaveURL(/rule=seat-lift-off/);
  await expect(page.getByTestId("layouts-blocked")).toContainText("lifts off");
  await expect(page.getByTestId("layouts-blocked")).not.toContainText("drives a free motion");
  await page.goto("/dashboard?rule=seat-lift-off&days=30");
  await expect(page.getByLabel("Rule")).toHaveValue("seat-lift-off");
  await expect(page.getByLabel("Trend period")).toHaveValue("30");
  // "Ready for release" says what it holds, or that it holds nothing
  await expect(page.getByTestId("layouts-ready")).not.toBeEmpty();
  const csv = await page.request.get("/api/dashboard?format=csv");
  expect(await csv.text()).toMatch(/^project,checker,open errors/);
});
