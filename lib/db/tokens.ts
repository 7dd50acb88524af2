/** Personal API tokens: created and shown once, stored as SHA-256 hashes, named, last use recorded, revocable. */
import "server-only";
import { iso, isoOrNull } from "./rows";
import { createHash, randomBytes } from "node:crypto";
import { z } from "zod";
import { db } from "./knex";
import { notFound } from "@/lib/errors";
import type { Role } from "@/lib/roles";

export const tokenInputSchema = z.object({
  name: z.string().trim().min(2, "Give the token a name of at least 2 characters.").max(100, "A name is at most 100 characters."),
});

export interface TokenDto {
  id: number;
  name: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

const hash = (token: string) => createHash("sha256").update(token).digest("hex");

/**
 * Recently verified tokens (hash → user) for 10 s, so a busy CAD script does not cost a database round trip per
 * request. Revoking clears the entry at once in this process; a role change or a disabled account takes up to 10 s.
 */
const verified = new Map<string, { user: { id: number; name: string; email: string; role: Role }; until: number }>();

/** Drops every cached token look-up (after an account is deactivated or its role changes). */
export function forgetTokens(): void {
  verified.clear();
}

/** An API token row (the hash is never mapped out). */
interface TokenRow {
  id: number;
  user_id: number;
  name: string;
  prefix: string;
  created_at: Date;
  last_used_at: Date | null;
  revoked_at: Date | null;
}

function toDto(r: TokenRow): TokenDto {
  return {
    id: r.id,
    name: r.name,
    prefix: r.prefix,
    createdAt: iso(r.created_at),
    lastUsedAt: isoOrNull(r.last_used_at),
    revokedAt: isoOrNull(r.revoked_at),
  };
}

/** Creates a token for the user; the plain token is returned only here. */
export async function createToken(user: { id: number }, name: string): Promise<{ token: string; info: TokenDto }> {
  const token = `sfx_${randomBytes(32).toString("base64url")}`;
  const [id] = await db()("api_tokens").insert({ user_id: user.id, name, prefix: token.slice(0, 12), token_hash: hash(token) });
  return { token, info: toDto(await db()("api_tokens").where({ id }).first()) };
}

/** The user's tokens (never their hashes). */
export async function listTokens(user: { id: number }): Promise<TokenDto[]> {
  return (await db()("api_tokens").where({ user_id: user.id }).orderBy("id", "desc")).map(toDto);
}

/** Revokes one of the user's tokens. */
export async function revokeToken(user: { id: number }, id: number): Promise<void> {
  const row = await db()("api_tokens").where({ id, user_id: user.id }).first();
  const n = await db()("api_tokens")
    .where({ id, user_id: user.id })
    .whereNull("revoked_at")
    .update({ revoked_at: db().fn.now(3) });
  if (n !== 1) throw notFound("That active token");
  verified.delete(row.token_hash);
}

/** The user behind a bearer token, or null for an unknown, revoked or malformed one; records the use. */
export async function authenticateToken(token: string): Promise<{ id: number; name: string; email: string; role: Role } | null> {
  if (!/^sfx_[A-Za-z0-9_-]{20,100}$/.test(token)) return null;
  const h = hash(token);
  const hit = verified.get(h);
  if (hit && hit.until > Date.now()) return hit.user;
  const row = await db()("api_tokens as t")
    .join("users as u", "u.id", "t.user_id")
    .where("t.token_hash", h)
    .whereNull("t.revoked_at")
    .where("u.active", true)
    .select("t.id", "u.id as uid", "u.name", "u.email", "u.role")
    .first();
  if (!row) return null;
  // last use to the minute: one write a minute per token, not one per request (busy scripts share a token)
  await db()("api_tokens")
    .where({ id: row.id })
    .where((q) => q.whereNull("last_used_at").orWhere("last_used_at", "<", db().raw("now(3) - interval 60 second")))
    .update({ last_used_at: db().fn.now(3) });
  const user = { id: row.uid as number, name: row.name as string, email: row.email as string, role: row.role as Role };
  if (verified.size > 5000) verified.clear();
  verified.set(h, { user, until: Date.now() + 10_000 });
  return user;
}
