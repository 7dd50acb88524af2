/** Projects: list for any signed-in user, create for managers. */
import "server-only";
import { iso } from "./rows";
import { db, transaction } from "./knex";
import { conflict, forbidden, invalid, notFound } from "@/lib/errors";
import { allowed } from "@/lib/policy";
import { listAudit, recordAudit, type AuditDto } from "./audit";
import type { SessionUser } from "@/lib/auth/session";
import type { ProjectDto, ProjectInput } from "@/lib/contracts/projects";
export type { ProjectDto, ProjectInput } from "@/lib/contracts/projects";
export { projectInputSchema, assignCheckerSchema } from "@/lib/contracts/projects";

interface ProjectRow {
  id: number;
  name: string;
  description: string;
  created_by: number;
  checker_id: number | null;
  created_at: Date;
  checker_name?: string | null;
  creator_name?: string | null;
  layout_count?: number | string;
  open_count?: number | string;
}

function toDto(row: ProjectRow): ProjectDto {
  return {
    id: row.id,
    name: row.name,
    description: row.description,
    checker: row.checker_id ? { id: row.checker_id, name: row.checker_name ?? "" } : null,
    createdBy: row.creator_name ?? null,
    createdAt: iso(row.created_at),
    layouts: Number(row.layout_count ?? 0),
    openFindings: Number(row.open_count ?? 0),
  };
}

function baseQuery() {
  return db()<ProjectRow>("projects as p")
    .leftJoin("users as c", "c.id", "p.checker_id")
    .leftJoin("users as u", "u.id", "p.created_by")
    .select(
      "p.*",
      "c.name as checker_name",
      "u.name as creator_name",
      db().raw("(select count(*) from layouts l where l.project_id = p.id) as layout_count"),
      db().raw(
        "(select count(*) from threads t join layouts l on l.id = t.layout_id where l.project_id = p.id and t.status in ('open', 'reopened')) as open_count",
      ),
    );
}

/** Lists every project, newest first. Every role may read projects. */
export async function listProjects(_user: SessionUser): Promise<ProjectDto[]> {
  const rows = await baseQuery().orderBy("p.created_at", "desc").orderBy("p.id", "desc");
  return rows.map(toDto);
}

/** Creates a project; managers only. */
export async function createProject(user: SessionUser, input: ProjectInput): Promise<ProjectDto> {
  if (user.role !== "manager") throw forbidden("Only managers create projects.");
  if (input.checkerId) {
    const checker = await db()("users").where({ id: input.checkerId, role: "checker", active: true }).first();
    if (!checker) throw invalid("The chosen checker does not exist.", { fieldErrors: { checkerId: ["Pick an active checker."] } });
  }
  const clash = await db()("projects").where({ name: input.name }).first();
  if (clash) throw conflict(`A project named "${input.name}" already exists.`);
  const [id] = await db()("projects").insert({
    name: input.name,
    description: input.description ?? "",
    created_by: user.id,
    checker_id: input.checkerId ?? null,
  });
  const row = await baseQuery().where("p.id", id).first();
  return toDto(row as ProjectRow);
}

/** One project. */
export async function getProject(_user: SessionUser, id: number): Promise<ProjectDto> {
  const row = await baseQuery().where("p.id", id).first();
  if (!row) throw notFound("That project");
  return toDto(row as ProjectRow);
}

/** A manager assigns or changes the project's checker (null leaves it open to every checker); recorded in the history. */
export async function assignChecker(user: SessionUser, projectId: number, checkerId: number | null): Promise<ProjectDto> {
  if (!allowed(user.role, "assignChecker")) throw forbidden("Only managers assign a project's checker.");
  const project = await db()("projects").where({ id: projectId }).first();
  if (!project) throw notFound("That project");
  let checkerName: string | null = null;
  if (checkerId !== null) {
    const checker = await db()("users").where({ id: checkerId, role: "checker", active: true }).first();
    if (!checker) throw invalid("The chosen checker does not exist or is not an active checker.", { fieldErrors: { checkerId: ["Pick an active checker."] } });
    checkerName = checker.name;
  }
  if ((project.checker_id ?? null) !== checkerId) {
    const before = project.checker_id ? ((await db()("users").where({ id: project.checker_id }).first())?.name ?? null) : null;
    await transaction(async (trx) => {
      await trx("projects").where({ id: projectId }).update({ checker_id: checkerId });
      await recordAudit(trx, {
        subject: "project",
        subjectId: projectId,
        kind: "checker-assigned",
        actorId: user.id,
        detail: { from: before, to: checkerName },
      });
    });
  }
  return getProject(user, projectId);
}

/** The administration history of a project (checker assignments), newest first. */
export async function projectHistory(_user: SessionUser, projectId: number): Promise<AuditDto[]> {
  return listAudit("project", projectId);
}
