import "server-only";
import { db } from "@/db";
import { assertCan, type Actor } from "@/lib/authz";
import type { PurchaseListDto } from "@/lib/contracts/wax";
import { purchaseList } from "@/lib/wax";
import { openRunWaxNeeds } from "../runs/purchase";
import { currentSettings } from "../settings";
import { listEstimates } from "./estimates";
import { loadMaterials, onHandByMaterial, toMaterialRef } from "./shared";

// What to buy: the saved estimates marked planned, summed by material, against stock on hand and each material's
// reorder level (lib/wax purchaseList), priced at today's prices per kg. A run being prepared or in work brings
// its waxing stages' estimates instead of its plans' planned estimates, so the same cloth is never counted twice.

export async function getPurchaseList(actor: Actor): Promise<PurchaseListDto> {
  assertCan(actor, "data:read");
  const [materials, onHand, allPlanned, { settings }, runNeeds] = await Promise.all([loadMaterials(db), onHandByMaterial(db), listEstimates(actor, { planned: true }), currentSettings(), openRunWaxNeeds()]);
  const planned = allPlanned.filter((e) => !(e.planId && runNeeds.planIds.has(e.planId)));
  const list = purchaseList(
    [...planned.map((e) => ({ byMaterial: e.results.byMaterial.map((m) => ({ material: m.material, kg: m.kg })) })), ...runNeeds.stages.map((s) => ({ byMaterial: s.byMaterial }))],
    materials.map((m) => ({ material: m.id, name: m.name, onHandKg: onHand.get(m.id) ?? 0, reorderLevelKg: m.reorderLevelKg, pricePerKg: m.pricePerKg })),
  );
  const byId = new Map(materials.map((m) => [m.id, m]));
  const ref = (id: string) => {
    const m = byId.get(id);
    return m ? toMaterialRef(m) : { id, code: id, name: id };
  };
  return {
    lines: list.lines.map((l) => ({
      material: ref(l.material),
      neededKg: l.neededKg,
      onHandKg: l.onHandKg,
      afterKg: l.afterKg,
      reorderLevelKg: l.reorderLevelKg,
      toBuyKg: l.toBuyKg,
      pricePerKg: l.pricePerKg,
      cost: l.cost,
      belowReorderNow: l.belowReorderNow,
      belowReorderAfter: l.belowReorderAfter,
    })),
    totalToBuyKg: list.totalToBuyKg,
    cost: list.cost,
    currency: settings.currency,
    pricesMissing: list.pricesMissing.map((id) => ref(id).name),
    belowReorder: list.belowReorder.map((id) => ref(id).name),
    estimates: planned.map((e) => ({ id: e.id, name: e.name, kgNew: e.results.kgNew, recipeName: e.recipe.name })),
    runStages: runNeeds.stages.map((s) => ({ runId: s.runId, runName: s.runName, stageId: s.stageId, position: s.position, kg: s.kg })),
  };
}
