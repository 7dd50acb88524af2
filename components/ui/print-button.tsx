"use client";
/** Opens the browser's print dialog (the page prints in black and white: shapes carry the meaning). */
export function PrintButton() {
  return (
    <button type="button" className="btn-quiet" onClick={() => window.print()}>
      Print
    </button>
  );
}
