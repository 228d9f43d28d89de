"use client";
export function PrintButton() {
  return (
    <button type="button" onClick={() => window.print()} className="rounded-plank border border-chalk-700 bg-chalk-600 px-3 py-1 text-sm text-white print:hidden">
      Print
    </button>
  );
}
