import "server-only";
import { notFound } from "next/navigation";
import type { RunDto } from "@/lib/contracts/runs";
import { getRun } from "@/lib/data/runs";
import { AppError } from "@/lib/errors";
import type { Actor } from "@/lib/session";
import { z } from "@/lib/zod";

/** The run of a page's address, or the shell's 404 for an address that names no run. */
export async function loadRun(actor: Actor, id: string): Promise<RunDto> {
  if (!z.uuid().safeParse(id).success) notFound();
  try {
    return await getRun(actor, id);
  } catch (error) {
    if (error instanceof AppError && error.code === "notFound") notFound();
    throw error;
  }
}
