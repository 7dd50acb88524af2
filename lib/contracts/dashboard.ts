/** Contracts of dashboard: the shapes route handlers answer with and components read, and the input schemas (no database, no server-only). */
import { z } from "zod";

export const dashboardFilterSchema = z.object({
  project: z.coerce.number().int().positive().optional(),
  checker: z.coerce.number().int().positive().optional(),
  rule: z
    .string()
    .regex(/^[a-z]+(-[a-z]+)*$/)
    .max(60)
    .optional(),
  days: z.coerce.number().int().min(7).max(365).default(60),
});

export type DashboardFilter = z.infer<typeof dashboardFilterSchema>;

export interface DashboardRow {
  projectId: number;
  project: string;
  checker: string | null;
  error: number;
  warning: number;
  info: number;
  underWeek: number;
  underMonth: number;
  older: number;
}

export interface DashboardDto {
  rows: DashboardRow[];
  totals: { error: number; warning: number; info: number; underWeek: number; underMonth: number; older: number };
  trend: { day: string; open: number }[];
  layouts: {
    id: number;
    name: string;
    project: string;
    revision: number;
    state: "ready" | "blocked" | "requested" | "released";
    blocking: { threadId: number; title: string }[];
  }[];
  rules: string[];
  projects: { id: number; name: string }[];
  checkers: { id: number; name: string }[];
}
