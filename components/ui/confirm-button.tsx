"use client";
/**
 * A button whose action needs a second, deliberate step: it opens a modal dialog (native <dialog>, so the
 * browser traps focus and Escape cancels) that says what will happen; the action runs only on confirm.
 */
import { useRef, type ReactNode } from "react";

export function ConfirmButton({
  label,
  title,
  children,
  confirmLabel,
  onConfirm,
  disabled,
  className = "btn",
  buttonTitle,
}: {
  label: string;
  title: string;
  children: ReactNode;
  confirmLabel: string;
  onConfirm: () => void;
  disabled?: boolean;
  className?: string;
  buttonTitle?: string;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  return (
    <>
      <button type="button" className={className} disabled={disabled} title={buttonTitle} onClick={() => ref.current?.showModal()}>
        {label}
      </button>
      <dialog ref={ref} className="sheet max-w-md p-5 backdrop:bg-graphite/40" aria-labelledby={`${title}-title`.replace(/\W+/g, "-")}>
        <h2 id={`${title}-title`.replace(/\W+/g, "-")} className="mb-2 text-base">
          {title}
        </h2>
        <div className="space-y-2 text-sm">{children}</div>
        <form method="dialog" className="mt-4 flex justify-end gap-2">
          <button type="submit" className="btn-quiet" value="cancel" autoFocus>
            Cancel
          </button>
          <button
            type="button"
            className="btn"
            onClick={() => {
              ref.current?.close();
              onConfirm();
            }}
          >
            {confirmLabel}
          </button>
        </form>
      </dialog>
    </>
  );
}
