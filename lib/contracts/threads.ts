/** Contracts of threads: the shapes route handlers answer with and components read, and the input schemas (no database, no server-only). */
import { z } from "zod";
import type { Severity, ThreadStatusName } from "./enums";
import type { EventDto } from "./events";

export type ThreadStatus = ThreadStatusName;

export interface CommentDto {
  id: number;
  author: { id: number; name: string; role: string };
  body: string;
  createdAt: string;
  editedAt: string | null;
  history: { body: string; replacedAt: string }[];
  mine: boolean;
}

export interface ThreadDto {
  id: number;
  layoutId: number;
  layoutName: string;
  projectId: number;
  projectName: string;
  fingerprint: string;
  rule: string;
  severity: Severity;
  title: string;
  status: ThreadStatus;
  waiverReason: string | null;
  waivedBy: string | null;
  version: number;
  readOnly: boolean;
  appearances: { revisionId: number; revisionNumber: number; findingId: number; body: string; contacts: string[]; loadCase: string | null }[];
  comments: CommentDto[];
  history: EventDto[];
}

export const commentSchema = z.object({ body: z.string().trim().min(1, "Write something first.").max(20000, "A comment is at most 20,000 characters.") });

export const statusSchema = z.discriminatedUnion("action", [
  z.object({
    action: z.literal("waive"),
    reason: z.string().trim().min(10, "Give a justification of at least 10 characters.").max(4000),
    version: z.number().int().positive(),
  }),
  z.object({ action: z.literal("reopen"), reason: z.string().trim().max(4000).default(""), version: z.number().int().positive() }),
]);
