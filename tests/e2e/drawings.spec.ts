/** Drawing views: four views on the layout page; a finding's page emphasises its contacts; a screenshot is kept. */
import { readFileSync } from "node:fs";
import path from "node:path";
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
  await page
    .getByTestId("findings-table")
    .getByRole("link", { name: /Over-constrained loop/ })
    .click();
  await expect(page.locator("svg[data-view]")).toHaveCount(4);
  // four involved contacts, in each of four views
  await expect(page.locator('[data-emphasised="true"]')).toHaveCount(16);
  await expect(page.locator('[data-emphasised="false"]')).toHaveCount(8);
  // keyboard focus on a contact shows its numbers
  await page.locator('svg[data-view="plan"] [data-contact="blade-A.a"]').focus();
  await expect(page.getByTestId("contact-info")).toContainText("blade-A.a");
  await expect(page.getByTestId("contact-info")).toContainText("mm");
  // a flexure row reads out its element: kind, dimensions and stiffness with units
  await expect(page.getByTestId("contact-info")).toContainText(
    /blade blade-A \(row a\): length 40 mm, width 60 mm, thickness 0\.25 mm, blade-steel, stiffness [\d.]+ N\/mm/,
  );
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

test("the layout page shows the temperature panel, the error budget and the flexures, with units", async ({ page }, info) => {
  await signInAs(page, "checker");
  await page.goto("/projects");
  await page.getByRole("link", { name: "Detachable instrument plate" }).click();
  await page.getByRole("link", { name: "Plate coupling" }).click();
  const thermal = page.getByTestId("thermal-panel");
  await expect(thermal).toContainText("instrument-plate");
  await expect(thermal).toContainText("µm/K");
  await expect(page.getByTestId("thermal-drift-table")).toContainText("detector-datum");
  const budget = page.getByTestId("repeatability-panel");
  await expect(budget).toContainText("3σ largest semi-axis (µm)");
  await expect(page.getByTestId("repeatability-table")).toContainText("alignment-mark");
  await expect(page.getByTestId("budget-chart").locator(".recharts-bar-rectangle").first()).toBeVisible();
  // sorting the contribution table by share puts the largest share first, then reverses on a second click
  const firstShare = () => page.getByTestId("contribution-table").locator("tbody tr").first().locator("td").nth(1).innerText();
  const top = Number(await firstShare());
  await page
    .getByTestId("contribution-table")
    .getByRole("button", { name: /share of variance/ })
    .click();
  expect(Number(await firstShare())).toBeLessThan(top);
  // the drawings mark the thermal centre and the 3σ ellipses in every view
  await expect(page.locator("svg[data-view] [data-thermal-centre]")).toHaveCount(4);
  await expect(page.locator("svg[data-view] [data-ellipse]")).toHaveCount(8);
  await page.screenshot({ path: info.outputPath("service-panels.png"), fullPage: true });

  await page.goto("/projects");
  await page.getByRole("link", { name: "Two-blade flexure stage" }).click();
  await page.getByRole("link", { name: "Stage guidance" }).click();
  await expect(page.getByTestId("flexure-panel")).toContainText("blade-A");
  await expect(page.getByTestId("flexure-panel")).toContainText("N/mm");
  await expect(page.locator('svg[data-view] [data-kind="blade"]')).toHaveCount(8);
});

test("labels do not overlap on the breadboard, and a finding's views are fitted to its contacts", async ({ page }) => {
  await signInAs(page, "checker");
  await page.goto("/projects");
  await page.getByRole("link", { name: "Interferometer breadboard" }).click();
  await page.getByRole("link", { name: "Breadboard support" }).click();
  await expect(page.locator("svg[data-view]")).toHaveCount(4);
  for (const view of ["plan", "front", "side", "axonometric"]) {
    const boxes = await page.locator(`svg[data-view="${view}"] [data-label]`).evaluateAll((els) =>
      els.map((e) => {
        const r = e.getBoundingClientRect();
        return [r.left, r.top, r.width, r.height];
      }),
    );
    expect(boxes.length).toBeGreaterThan(3);
    for (let i = 0; i < boxes.length; i++)
      for (let j = i + 1; j < boxes.length; j++) {
        const [a, b] = [boxes[i], boxes[j]];
        const hit = a[0] < b[0] + b[2] - 0.5 && b[0] < a[0] + a[2] - 0.5 && a[1] < b[1] + b[3] - 0.5 && b[1] < a[1] + a[3] - 0.5;
        expect(hit, `${view}: labels ${i} and ${j} overlap`).toBe(false);
      }
  }
  await expect(page.locator("svg[data-view] [data-outline]")).toHaveCount(4);
  // the mouse wheel zooms the view under it (and the scale bar stays in its corner)
  const plan = page.locator('svg[data-view="plan"]');
  const before = await plan.getAttribute("viewBox");
  await plan.hover();
  await page.mouse.wheel(0, -300);
  await expect(plan).not.toHaveAttribute("viewBox", before ?? "");

  // the whole plate, then one lifted seat's finding: its views are fitted closer (a shorter scale bar length)
  await page.goto("/projects");
  await page.getByRole("link", { name: "Detachable instrument plate" }).click();
  await page.getByRole("link", { name: "Plate coupling" }).click();
  await expect(page.getByTestId("findings-table")).toBeVisible();
  await expect(page.locator("svg[data-view]")).toHaveCount(4);
  const whole = parseFloat((await page.locator('svg[data-view="plan"] [data-testid="scale-bar"]').textContent()) ?? "");
  await page
    .getByTestId("findings-table")
    .getByRole("link", { name: /inverted: flat lifts off/ })
    .click();
  await expect(page).toHaveURL(/\/findings\//);
  // the finding's own page (the layout page's drawings may linger during the client-side navigation)
  await expect(page.getByRole("heading", { name: /Discussion/ })).toBeVisible();
  await expect(page.locator('[data-emphasised="true"]').first()).toBeAttached();
  const focused = parseFloat((await page.locator('svg[data-view="plan"] [data-testid="scale-bar"]').textContent()) ?? "");
  expect(focused, `scale bar ${focused} on the finding against ${whole} for the whole plate`).toBeLessThan(whole);
});

test("one body filter narrows the drawings and the detail tables, and lives in the address", async ({ page }, info) => {
  // the breadboard on its three seats carrying a mirror mount on a 3-2-1 set of pads (two bodies; demo data)
  const board = JSON.parse(readFileSync(path.join("examples", "breadboard-three-seats.json"), "utf8"));
  const pad = (id: string, point: number[], normal: number[]) => ({ id, body: "mirror-mount", on: "breadboard", point, normal, sense: "bilateral" });
  board.name = "Larkspur breadboard with a mirror mount";
  // every seat lands within 0.5 µm (1σ) so the error budget is computed
  board.defaultScatter = 0.0005;
  board.bodies.push({ id: "mirror-mount", mass: 1.2, centerOfMass: [300, 225, 80] });
  board.contacts.push(
    pad("M1", [280, 205, 60], [0, 0, 1]),
    pad("M2", [320, 205, 60], [0, 0, 1]),
    pad("M3", [300, 245, 60], [0, 0, 1]),
    pad("M4", [280, 205, 70], [0, 1, 0]),
    pad("M5", [320, 205, 70], [0, 1, 0]),
    pad("M6", [280, 225, 70], [1, 0, 0]),
  );
  await signInAs(page, "designer");
  await page.goto("/projects");
  await page.getByRole("link", { name: "Interferometer breadboard" }).click();
  const name = `Bench with mount ${Date.now()}`;
  await page.getByLabel("Layout name").fill(name);
  await page.getByRole("button", { name: "Add layout" }).click();
  await page.getByRole("link", { name }).click();
  await page
    .locator('input[aria-label="Layout file"]')
    .setInputFiles({ name: "bench.json", mimeType: "application/json", buffer: Buffer.from(JSON.stringify(board)) });
  await expect(page.getByTestId("upload-status")).toContainText("Revision 1 stored");
  const rows = page.getByTestId("load-case-table").locator("tbody tr");
  await page.getByTestId("load-case-details").locator("summary").click();
  await expect(rows).toHaveCount(12);
  await page.getByLabel("Show body").selectOption("mirror-mount");
  await expect(page).toHaveURL(/[?&]body=mirror-mount/);
  // the seat-force table lists only the mount's six pads; the drawings emphasise them in every view
  await expect(rows).toHaveCount(6);
  await expect(page.getByTestId("load-case-details").getByTestId("filtered-note")).toContainText("6 of 12 contacts touch mirror-mount");
  await expect(page.locator('svg[data-view] [data-emphasised="true"]')).toHaveCount(24);
  // the breadboard's functional point is not on the mount: the budget says so and keeps every point
  await expect(page.getByTestId("repeatability-panel").getByTestId("filtered-note")).toContainText("No functional point on mirror-mount");
  // the address alone restores the filter
  await page.reload();
  await expect(page.getByLabel("Show body")).toHaveValue("mirror-mount");
  await expect(rows).toHaveCount(6);
  await page.getByLabel("Show body").selectOption("");
  await expect(page).not.toHaveURL(/body=/);
  await expect(page.locator('svg[data-view] [data-emphasised="true"]')).toHaveCount(0);
  // the filter and the narrowed drawings at desk and phone width (kept as artifacts), the filter inside the page
  await page.getByLabel("Show body").selectOption("mirror-mount");
  for (const [name, width] of [
    ["desk", 1440],
    ["phone", 390],
  ] as const) {
    await page.setViewportSize({ width, height: 900 });
    await page.getByTestId("body-filter").scrollIntoViewIfNeeded();
    const box = (await page.getByTestId("body-filter").boundingBox())!;
    expect(box.x + box.width).toBeLessThanOrEqual(width);
    await page.screenshot({ path: info.outputPath(`body-filter-${name}.png`) });
  }
});
