/** Users: look-ups and credential checks; never hands a password hash to a caller. */
import "server-only";
import bcrypt from "bcryptjs";
import { db } from "./knex";
import type { Role } from "@/lib/roles";

interface UserRow {
  id: number;
  email: string;
  name: string;
  role: Role;
  password_hash: string;
  active: number | boolean;
  created_at: Date;
}

export interface UserDto {
  id: number;
  email: string;
  name: string;
  role: Role;
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
