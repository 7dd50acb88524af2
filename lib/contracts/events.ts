/** Contracts of events: the shapes route handlers answer with and components read, and the input schemas (no database, no server-only). */

export type EventKind =
  "upload" | "upload-refused" | "comment" | "comment-edit" | "open" | "waive" | "reopen" | "resolve" | "release-request" | "release-withdraw" | "release";

export interface EventDto {
  id: number;
  kind: EventKind;
  actor: string | null;
  threadId: number | null;
  revisionId: number | null;
  detail: Record<string, unknown>;
  createdAt: string;
}
