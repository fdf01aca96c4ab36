"use client";

import { Button } from "@/components/ui/button";

/** Prints the page (the shell and the tabs hide themselves in print). */
export function PrintButton({ label }: { label: string }) {
  return (
    <Button type="button" variant="secondary" className="print:hidden" onClick={() => window.print()}>
      {label}
    </Button>
  );
}
