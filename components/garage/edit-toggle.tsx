"use client";

import { createContext, useContext, useState, type ReactNode } from "react";

// "Edit" beside a garage row: opens the row's form in place; the form closes it once saved
// (useCloseEdit), and "Cancel" closes it without sending anything.

const CloseEdit = createContext<(() => void) | null>(null);

/** Inside an EditToggle: closes it. Elsewhere: null (an "add" form stays open). */
export const useCloseEdit = () => useContext(CloseEdit);

export function EditToggle({ label, testId, children }: { label: string; testId?: string; children: ReactNode }) {
  const [open, setOpen] = useState(false);
  if (!open) {
    return (
      <button type="button" className="sb-button sb-button-quiet" onClick={() => setOpen(true)} data-testid={testId}>
        {label}
      </button>
    );
  }
  return (
    <div className="w-full space-y-2">
      <CloseEdit.Provider value={() => setOpen(false)}>{children}</CloseEdit.Provider>
      <button type="button" className="sb-button sb-button-quiet" onClick={() => setOpen(false)}>
        Cancel
      </button>
    </div>
  );
}
