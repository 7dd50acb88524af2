"use client";
/**
 * The body filter of the layout page: one choice that narrows the drawings (the body's contacts stand out and the
 * views fit to them) and every detail table (seat forces, flexures, temperature, repeatability) to one body.
 * A contact, flexure or row belongs to a body when it is on either side of it (`body` or `on`).
 */
import type { Layout } from "@/lib/layout/model";
import { expandFlexures } from "@/lib/layout/flexures";

/** What belongs to the chosen body; everything when none is chosen. */
export interface BodyScope {
  body: string;
  contact: (id: string) => boolean;
  flexure: (id: string) => boolean;
  point: (id: string) => boolean;
  bodyRow: (id: string) => boolean;
}

export function bodyScope(layout: Layout, body: string): BodyScope {
  if (!body) return { body, contact: () => true, flexure: () => true, point: () => true, bodyRow: () => true };
  const touches = (x: { body: string; on: string }) => x.body === body || x.on === body;
  const contacts = new Set(
    expandFlexures(layout)
      .contacts.filter(touches)
      .map((c) => c.id),
  );
  const flexures = new Set((layout.flexures ?? []).filter(touches).map((f) => f.id));
  const points = new Set(layout.points.filter((p) => p.body === body).map((p) => p.id));
  return { body, contact: (id) => contacts.has(id), flexure: (id) => flexures.has(id), point: (id) => points.has(id), bodyRow: (id) => id === body };
}

/** The select that sets the filter, with what it narrows. */
export function BodyFilter({ layout, value, onChange }: { layout: Layout; value: string; onChange: (body: string) => void }) {
  if (layout.bodies.length < 2) return null;
  return (
    <div className="sheet flex flex-wrap items-center gap-2 p-3 text-xs" data-testid="body-filter">
      <label htmlFor="body-filter" className="font-semibold">
        Show body
      </label>
      <select id="body-filter" className="field w-auto py-1 text-xs" value={value} onChange={(e) => onChange(e.target.value)}>
        <option value="">all bodies ({layout.bodies.length})</option>
        {layout.bodies.map((b) => (
          <option key={b.id} value={b.id}>
            {b.id}
          </option>
        ))}
      </select>
      <span className="text-graphite-soft">
        {value
          ? `Drawings fitted to ${value}; tables list only its contacts, flexures, points and thermal rows.`
          : "Narrows the drawings and every table below to one body."}
      </span>
    </div>
  );
}

/** "n of m" note under a filtered table. */
export function FilteredNote({ scope, shown, total, what }: { scope: BodyScope; shown: number; total: number; what: string }) {
  if (!scope.body) return null;
  return (
    <p className="text-xs text-graphite-soft" data-testid="filtered-note">
      {shown} of {total} {what} touch {scope.body}.
    </p>
  );
}
