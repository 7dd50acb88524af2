/** Severity and status badges: shape and text carry the meaning, colour only adds to it. */
const sevMark = { error: "■", warning: "▲", info: "●" } as const;
import type { Severity } from "@/lib/contracts/enums";

export function SeverityBadge({ severity }: { severity: Severity | string }) {
  const s = (["error", "warning", "info"].includes(severity) ? severity : "info") as keyof typeof sevMark;
  return (
    <span className={`badge badge-${s}`} data-severity={s}>
      <span aria-hidden="true">{sevMark[s]}</span>
      {s}
    </span>
  );
}

const statusText: Record<string, string> = { open: "open", reopened: "reopened", waived: "waived", resolved: "resolved" };

export function StatusBadge({ status }: { status: string }) {
  const style = status === "resolved" ? "badge-neutral" : status === "waived" ? "badge-neutral italic" : "border-graphite/40 bg-white text-graphite";
  return (
    <span className={`badge ${style}`} data-status={status}>
      {status === "resolved" ? "✓ " : status === "waived" ? "≈ " : "○ "}
      {statusText[status] ?? status}
    </span>
  );
}
