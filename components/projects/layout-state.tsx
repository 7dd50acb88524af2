/** The review state of a layout in one word, with a shape so it reads without colour. */
export interface LayoutStateInput {
  revisions: number;
  openErrors: number;
  released: boolean;
  releaseRequested: boolean;
}

export function layoutState(l: LayoutStateInput): { key: string; label: string } {
  if (l.revisions === 0) return { key: "empty", label: "no revision yet" };
  if (l.released) return { key: "released", label: "released" };
  if (l.openErrors > 0) return { key: "blocked", label: `blocked by ${l.openErrors} error${l.openErrors === 1 ? "" : "s"}` };
  if (l.releaseRequested) return { key: "requested", label: "release requested" };
  return { key: "ready", label: "ready for release" };
}

export function LayoutStateBadge({ state }: { state: LayoutStateInput }) {
  const s = layoutState(state);
  const style: Record<string, string> = {
    empty: "badge-neutral",
    released: "border-teal bg-teal-light text-teal-dark",
    blocked: "badge-error",
    requested: "badge-info",
    ready: "border-teal/50 bg-white text-teal-dark",
  };
  const mark: Record<string, string> = { empty: "–", released: "◆", blocked: "■", requested: "◇", ready: "○" };
  return (
    <span className={`badge ${style[s.key]}`} data-state={s.key}>
      <span aria-hidden="true">{mark[s.key]}</span>
      {s.label}
    </span>
  );
}
