"use client";

import { Button } from "@/components/ui/button";

/** Opens the browser's print dialog for the stamping sheet. */
export function PrintSheetButton({ label }: { label: string }) {
  return (
    <Button type="button" onClick={() => window.print()}>
      {label}
    </Button>
  );
}
