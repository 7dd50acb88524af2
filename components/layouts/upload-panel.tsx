"use client";
/** Drag-and-drop upload of a layout file with progress through upload and analysis, and located errors on refusal. */
import { useState } from "react";
import { useDropzone } from "react-dropzone";

type Phase =
  | { kind: "idle" }
  | { kind: "uploading"; percent: number; name: string }
  | { kind: "analysing"; name: string }
  | { kind: "done"; number: number; warnings: string[] }
  | { kind: "refused"; name: string; errors: { location: string; message: string }[]; message: string }
  | { kind: "failed"; message: string };

export function UploadPanel({ layoutId, onUploaded }: { layoutId: number; onUploaded: (revisionId: number) => void }) {
  const [phase, setPhase] = useState<Phase>({ kind: "idle" });
  const [length, setLength] = useState("mm");
  const [force, setForce] = useState("N");

  function send(file: File) {
    const form = new FormData();
    form.append("file", file);
    form.append("length", length);
    form.append("force", force);
    const xhr = new XMLHttpRequest();
    xhr.open("POST", `/api/layouts/${layoutId}/revisions`);
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) setPhase({ kind: "uploading", percent: Math.round((100 * e.loaded) / e.total), name: file.name });
    };
    xhr.upload.onload = () => setPhase({ kind: "analysing", name: file.name });
    xhr.onerror = () => setPhase({ kind: "failed", message: "The server could not be reached. Your file is unchanged; try again." });
    xhr.onload = () => {
      let body: { error?: string; errors?: { location: string; message: string }[]; revision?: { id: number; number: number }; warnings?: string[] } = {};
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        /* non-JSON answer */
      }
      if (xhr.status === 201 && body.revision) {
        setPhase({ kind: "done", number: body.revision.number, warnings: body.warnings ?? [] });
        onUploaded(body.revision.id);
      } else if (xhr.status === 422 || xhr.status === 413) {
        setPhase({ kind: "refused", name: file.name, errors: body.errors ?? [], message: body.error ?? "The file was refused." });
      } else {
        setPhase({ kind: "failed", message: body.error ?? `The server answered ${xhr.status}. Nothing was stored.` });
      }
    };
    setPhase({ kind: "uploading", percent: 0, name: file.name });
    xhr.send(form);
  }

  const { getRootProps, getInputProps, isDragActive } = useDropzone({
    multiple: false,
    accept: { "application/json": [".json"], "application/xml": [".xml"], "text/xml": [".xml"], "text/csv": [".csv"] },
    onDropAccepted: (files) => send(files[0]),
    onDropRejected: (rej) =>
      setPhase({
        kind: "refused",
        name: rej[0]?.file.name ?? "file",
        errors: [{ location: "file", message: "only .json, .xml and .csv layout files are accepted" }],
        message: "That file type is not a layout.",
      }),
  });
  const busy = phase.kind === "uploading" || phase.kind === "analysing";

  return (
    <section className="sheet space-y-3 p-4" aria-labelledby="upload-heading">
      <h2 id="upload-heading" className="text-base">
        Upload a revision
      </h2>
      <div
        {...getRootProps({
          className: `cursor-pointer rounded-sm border border-dashed px-4 py-6 text-center text-sm ${isDragActive ? "border-teal bg-teal-light" : "border-graphite/40"}`,
        })}
        data-testid="dropzone"
      >
        <input {...getInputProps()} aria-label="Layout file" disabled={busy} />
        {isDragActive ? "Drop the file here" : "Drop a layout file (JSON, XML or CSV) here, or click to choose one"}
      </div>
      <div className="flex flex-wrap items-end gap-3 text-sm">
        <span className="text-xs text-graphite-soft">Units for CSV files:</span>
        <label className="flex items-center gap-1">
          <span className="text-xs">length</span>
          <select className="field w-auto py-1" value={length} onChange={(e) => setLength(e.target.value)} aria-label="CSV length unit">
            {["mm", "m", "um", "in"].map((u) => (
              <option key={u} value={u}>
                {u === "um" ? "µm" : u}
              </option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-1">
          <span className="text-xs">force</span>
          <select className="field w-auto py-1" value={force} onChange={(e) => setForce(e.target.value)} aria-label="CSV force unit">
            {["N", "kN", "lbf"].map((u) => (
              <option key={u} value={u}>
                {u}
              </option>
            ))}
          </select>
        </label>
      </div>
      <div aria-live="polite" data-testid="upload-status">
        {phase.kind === "uploading" && (
          <div>
            <div className="text-sm">
              Uploading {phase.name}… <span className="num">{phase.percent} %</span>
            </div>
            <progress className="w-full" max={100} value={phase.percent} />
          </div>
        )}
        {phase.kind === "analysing" && (
          <div>
            <div className="text-sm">Analysing {phase.name}: rank, screws, seating, contacts…</div>
            <progress className="w-full" />
          </div>
        )}
        {phase.kind === "done" && (
          <div className="text-sm">
            <p className="text-teal-dark">Revision {phase.number} stored and analysed.</p>
            {phase.warnings.length > 0 && (
              <ul
                className="mt-1 rounded-sm border border-severity-warning/40 bg-severity-warning-bg p-2 text-xs text-severity-warning"
                data-testid="upload-warnings"
              >
                {phase.warnings.map((w) => (
                  <li key={w}>▲ {w}</li>
                ))}
              </ul>
            )}
          </div>
        )}
        {phase.kind === "failed" && (
          <p role="alert" className="text-sm text-severity-error">
            {phase.message}
          </p>
        )}
        {phase.kind === "refused" && (
          <div role="alert" className="rounded-sm border border-severity-error/40 bg-severity-error-bg p-3 text-sm text-severity-error">
            <p className="font-medium">
              {phase.name}: {phase.message}
            </p>
            <ul className="mt-2 space-y-1" data-testid="upload-errors">
              {phase.errors.map((e, i) => (
                <li key={i}>
                  <code className="num">{e.location}</code> — {e.message}
                </li>
              ))}
            </ul>
          </div>
        )}
      </div>
    </section>
  );
}
