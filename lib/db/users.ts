/** Users: look-ups and credential checks; never hands a password hash to a caller. */
import "server-only";
import bcrypt from "bcryptjs";
import { z } from "zod";
import { db, transaction } from "./knex";
import { iso } from "./rows";
import { recordAudit } from "./audit";
import { forgetTokens } from "./tokens";
import type { Role } from "@/lib/roles";
import { allowed } from "@/lib/policy";
import { conflict, forbidden, notFound } from "@/lib/errors";
import type { SessionUser } from "@/lib/auth/session";
import type { UserDto, AdminUserDto } from "@/lib/contracts/users";
import { newUserSchema, userChangeSchema } from "@/lib/contracts/users";
export type { UserDto, AdminUserDto } from "@/lib/contracts/users";
export { newUserSchema, userChangeSchema } from "@/lib/contracts/users";

interface UserRow {
  id: number;
  email: string;
  name: string;
  role: Role;
  password_hash: string;
  active: number | boolean;
  created_at: Date;
}

function toDto(row: UserRow): UserDto {
  return { id: row.id, email: row.email, name: row.name, role: row.role };
}

/** Checks an e-mail and password; returns the user or null (same answer for unknown e-mail and wrong password). */
export async function verifyCredentials(email: string, password: string): Promise<UserDto | null> {
  const row = await db()<UserRow>("users").where({ email: email.trim().toLowerCase() }).first();
  if (!row || !row.active) {
    await bcrypt.compare(password, "$2b$10$CwTycUXWue0Thq9StjUM0uJ8.uk8U1kQ0l6m0G6QJ3bMZZ1D2aQ6e");
    return null;
  }
  return (await bcrypt.compare(password, row.password_hash)) ? toDto(row) : null;
}

/** Finds an active user by id. */
export async function findUserById(id: number): Promise<UserDto | null> {
  const row = await db()<UserRow>("users").where({ id }).first();
  return row && row.active ? toDto(row) : null;
}

/** Lists users of one role (for pickers such as the project checker). */
export async function listUsersByRole(role: Role): Promise<UserDto[]> {
  const rows = await db()<UserRow>("users").where({ role, active: true }).orderBy("name");
  return rows.map(toDto);
}

/** People who can be @mentioned: name and handle (the part of the e-mail before the @). */
export async function listMentionableUsers(): Promise<{ name: string; handle: string; role: Role }[]> {
  const rows = await db()<UserRow>("users").where({ active: true }).orderBy("name");
  return rows.map((r) => ({ name: r.name, handle: r.email.split("@")[0], role: r.role }));
}

const adminDto = (r: UserRow): AdminUserDto => ({ ...toDto(r), active: !!r.active, createdAt: iso(r.created_at) });

/** Every account, active or not (admins only). */
export async function listAllUsers(user: SessionUser): Promise<AdminUserDto[]> {
  if (!allowed(user.role, "manageUsers")) throw forbidden("Only administrators manage users.");
  const rows = await db()<UserRow>("users").orderBy("name");
  return rows.map(adminDto);
}

/** Adds an account (admins only); recorded in the audit log. */
export async function addUser(user: SessionUser, input: z.infer<typeof newUserSchema>): Promise<AdminUserDto> {
  if (!allowed(user.role, "manageUsers")) throw forbidden("Only administrators manage users.");
  if (await db()("users").where({ email: input.email }).first()) throw conflict(`An account for ${input.email} already exists.`);
  const hash = await bcrypt.hash(input.password, 10);
  const id = await transaction(async (trx) => {
    const [newId] = await trx("users").insert({ name: input.name, email: input.email, role: input.role, password_hash: hash, active: true });
    await recordAudit(trx, { subject: "user", subjectId: newId, kind: "user-added", actorId: user.id, detail: { name: input.name, role: input.role } });
    return newId as number;
  });
  return adminDto((await db()<UserRow>("users").where({ id }).first())!);
}

/**
 * Changes an account's role or deactivates / reactivates it (admins only). A deactivated account cannot
 * sign in or use its tokens; its history stays. An admin cannot lock themselves out.
 */
export async function changeUser(user: SessionUser, id: number, change: z.infer<typeof userChangeSchema>): Promise<AdminUserDto> {
  if (!allowed(user.role, "manageUsers")) throw forbidden("Only administrators manage users.");
  const row = await db()<UserRow>("users").where({ id }).first();
  if (!row) throw notFound("That user");
  if (id === user.id && (change.active === false || (change.role && change.role !== "admin")))
    throw conflict("You cannot deactivate yourself or give up your own admin role; ask another administrator.");
  await transaction(async (trx) => {
    if (change.role && change.role !== row.role) {
      await trx("users").where({ id }).update({ role: change.role });
      await recordAudit(trx, {
        subject: "user",
        subjectId: id,
        kind: "role-changed",
        actorId: user.id,
        detail: { name: row.name, from: row.role, to: change.role },
      });
      // a project may not keep a checker who is no longer one
      if (row.role === "checker") {
        for (const p of await trx("projects").where({ checker_id: id }).select("id")) {
          await trx("projects").where({ id: p.id }).update({ checker_id: null });
          await recordAudit(trx, {
            subject: "project",
            subjectId: p.id,
            kind: "checker-assigned",
            actorId: user.id,
            detail: { from: row.name, to: null, why: "no longer a checker" },
          });
        }
      }
    }
    if (change.active !== undefined && change.active !== !!row.active) {
      await trx("users").where({ id }).update({ active: change.active });
      await recordAudit(trx, {
        subject: "user",
        subjectId: id,
        kind: change.active ? "user-reactivated" : "user-deactivated",
        actorId: user.id,
        detail: { name: row.name },
      });
    }
  });
  forgetTokens();
  return adminDto((await db()<UserRow>("users").where({ id }).first())!);
}
