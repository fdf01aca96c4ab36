import { notFound } from "next/navigation";
import type { Actor } from "@/lib/authz";
import type { RecipeDto } from "@/lib/contracts/wax";
import { getRecipe } from "@/lib/data/wax";
import { AppError } from "@/lib/errors";
import { z } from "@/lib/zod";

/** The recipe at an address, or the 404 page for an id that is not one or names none. */
export async function loadRecipe(actor: Actor, id: string): Promise<RecipeDto> {
  if (!z.uuid().safeParse(id).success) notFound();
  try {
    return await getRecipe(actor, id);
  } catch (error) {
    if (error instanceof AppError && error.code === "notFound") notFound();
    throw error;
  }
}
