/** Contracts of users: the shapes route handlers answer with and components read, and the input schemas (no database, no server-only). */
import { z } from "zod";
import type { Role } from "@/lib/roles";
import { roles } from "@/lib/roles";

export interface UserDto {
  id: number;
  email: string;
  name: string;
  role: Role;
}

export interface AdminUserDto extends UserDto {
  active: boolean;
  createdAt: string;
}

export const newUserSchema = z.object({
  name: z.string().trim().min(2, "Name needs at least 2 characters.").max(100, "Name is at most 100 characters."),
  email: z.string().trim().toLowerCase().email("Enter an e-mail address.").max(200),
  role: z.enum(roles, { error: "Pick a role." }),
  password: z.string().min(10, "A password has at least 10 characters.").max(200),
});

export const userChangeSchema = z
  .object({ role: z.enum(roles, { error: "Pick a role." }).optional(), active: z.boolean().optional() })
  .refine((v) => v.role !== undefined || v.active !== undefined, { message: "Say what changes: role or active." });
