/**
 * Demo review data for Larkspur Photonics, produced by running the real engine on the example files
 * and storing the results through the same lib/db functions the app uses. Safe to re-run: a layout
 * that exists is left alone.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import type { Knex } from "knex";
import { parseLayoutText } from "../../lib/layout";
import { runEngine } from "../../lib/engine";
import { storeRevision } from "../../lib/db/revisions";
import { addComment, changeStatus } from "../../lib/db/threads";
import { approveRelease, requestRelease } from "../../lib/db/releases";
import { releaseReportMarkdown } from "../../lib/report/release";
import type { SessionUser } from "../../lib/auth/session";

const examples = path.join(path.dirname(new URL(import.meta.url).pathname), "..", "..", "examples");

function analysed(file: string) {
  const text = readFileSync(path.join(examples, file), "utf8");
  const parsed = parseLayoutText(text, { fileName: file });
  if (!parsed.ok) throw new Error(`example ${file} does not parse`);
  const { report } = runEngine(parsed.layout);
  return {
    fileName: file,
    encoding: file.endsWith(".xml") ? ("xml" as const) : file.endsWith(".csv") ? ("csv" as const) : ("json" as const),
    raw: text,
    layout: parsed.layout,
    report,
  };
}

async function user(knex: Knex, role: string): Promise<SessionUser> {
  const u = await knex("users").where({ role }).orderBy("id").first();
  return { id: u.id, name: u.name, email: u.email, role: u.role };
}

async function layout(knex: Knex, projectName: string, name: string, description: string, designer: SessionUser): Promise<number | null> {
  const project = await knex("projects").where({ name: projectName }).first();
  if (!project) return null;
  if (await knex("layouts").where({ project_id: project.id, name }).first()) return null;
  const [id] = await knex("layouts").insert({ project_id: project.id, name, description, created_by: designer.id });
  return id;
}

async function thread(knex: Knex, layoutId: number, rule: string): Promise<{ id: number; version: number }> {
  const t = await knex("threads").where({ layout_id: layoutId, rule }).orderBy("id").first();
  return { id: t.id, version: t.version };
}

/**
 * Spreads a demo layout's history over the past weeks (its events evenly between `fromDays` and `toDays`
 * ago, and the rows they describe with them), so the dashboard's trend shows a review that converges.
 * Events of the kinds in `keep` stay at their real time (a filed release report names its own date).
 */
async function backdate(knex: Knex, layoutId: number, fromDays: number, toDays: number, keep: string[] = []): Promise<void> {
  const events: { id: number; kind: string; revision_id: number | null; thread_id: number | null; detail: string }[] = await knex("events")
    .where({ layout_id: layoutId })
    .whereNotIn("kind", keep)
    .orderBy("id");
  const day = 86400000;
  const now = Date.now();
  for (const [i, e] of events.entries()) {
    const at = new Date(now - (fromDays - ((fromDays - toDays) * i) / Math.max(1, events.length - 1)) * day);
    await knex("events").where({ id: e.id }).update({ created_at: at });
    if (e.kind === "upload" && e.revision_id) await knex("revisions").where({ id: e.revision_id }).update({ created_at: at });
    if (e.kind === "open" && e.thread_id) await knex("threads").where({ id: e.thread_id }).update({ opened_at: at, updated_at: at });
    if (e.kind === "comment") {
      const commentId = (JSON.parse(e.detail) as { commentId?: number }).commentId;
      if (commentId) await knex("comments").where({ id: commentId }).update({ created_at: at });
    }
    if (e.kind === "release-request" && e.revision_id) await knex("releases").where({ revision_id: e.revision_id }).update({ requested_at: at });
  }
}

export async function seed(knex: Knex): Promise<void> {
  const dana = await user(knex, "designer");
  const chen = await user(knex, "checker");

  // 1. Breadboard: four feet, reviewed, then three seats; release requested
  const board = await layout(
    knex,
    "Interferometer breadboard",
    "Breadboard support",
    "Support of the 600 × 450 mm interferometer breadboard on the lab bench.",
    dana,
  );
  if (board) {
    await storeRevision(dana, board, analysed("breadboard-four-feet.json"));
    const loop = await thread(knex, board, "redundant-constraint");
    await addComment(
      chen,
      loop.id,
      [
        "Four semi-firm feet on a rigid plate: the warp mode takes",
        "",
        "$$\\Delta F = \\frac{k\\,\\delta}{4} = \\frac{40\\ \\text{N}/\\mu\\text{m} \\times 1\\ \\mu\\text{m}}{4} = 10\\ \\text{N}$$",
        "",
        "| bench warp | foot force change | plate |",
        "|---|---|---|",
        "| 1 µm | ±10 N | bends with the bench |",
        "| 5 µm | ±50 N | beam splitter tilts |",
        "",
        "@dana can we go to three seats?",
      ].join("\n"),
    );
    await addComment(dana, loop.id, "Agreed. Revision 2 puts the board on three ball-in-vee seats with the grooves along the bisectors.");
    const free = await thread(knex, board, "free-motion");
    await addComment(chen, free.id, "The board can also slide on the feet: **x**, **y** and rotation about **z** are free. Three vees fix them too.");
    await storeRevision(dana, board, analysed("breadboard-three-seats.json"));
    const rev = await knex("revisions").where({ layout_id: board }).orderBy("number", "desc").first();
    await requestRelease(dana, rev.id);
    await backdate(knex, board, 38, 16);
  }

  // 2. Instrument plate: preload too weak for shipping and inverted handling (open errors block release)
  const plate = await layout(
    knex,
    "Detachable instrument plate",
    "Plate coupling",
    "Socket, vee and flat under the detector plate; nest spring preload.",
    dana,
  );
  if (plate) {
    await storeRevision(dana, plate, analysed("instrument-plate-socket-vee-flat.xml"));
    const lift = await thread(knex, plate, "seat-lift-off");
    await addComment(
      chen,
      lift.id,
      "The 40 N nest spring does not hold the plate in the 2 g lateral shipping case. Increase the preload or add a transport clamp, then re-upload.",
    );
    await backdate(knex, plate, 12, 9);
  }

  // 3. Flexure stage: one redundancy waived with a reason, then released
  const stage = await layout(
    knex,
    "Two-blade flexure stage",
    "Stage guidance",
    "Carriage on two parallel blades; travel along x is the intended freedom.",
    dana,
  );
  if (stage) {
    await storeRevision(dana, stage, analysed("flexure-stage-full-blades.json"));
    const red = await thread(knex, stage, "redundant-constraint");
    await addComment(dana, red.id, "Both blades are 0.25 mm spring steel; the doubled rotation about y is taken up by blade twist.");
    await changeStatus(chen, red.id, {
      action: "waive",
      reason: "Blade torsional compliance (about 2 N·mm/mrad) absorbs the redundant rotation; base flatness on the drawing is 5 µm. Accepted for this stage.",
      version: red.version,
    });
    const rev = await knex("revisions").where({ layout_id: stage }).orderBy("number", "desc").first();
    await requestRelease(dana, rev.id);
    await approveRelease(chen, rev.id, (rid, approval) => releaseReportMarkdown(chen, rid, approval));
    await backdate(knex, stage, 24, 3, ["release-request", "release"]);
  }
}
