import { z } from "@/lib/zod";
import { keyed } from "./errors";
import { MATERIAL_REF_MAX_CHARS, NAME_MAX_CHARS, PRICE_MAX_PER_KG, STOCK_MAX_KG } from "./limits";

/**
 * Stock of one material as the purchase list reads it: kg on hand (the sum of its movements; may be negative
 * when more use than receipts was recorded), reorder level kg, price per kg in the workshop's currency.
 */
export const stockLineSchema = z.object(
  {
    material: z.string(keyed).trim().min(1, keyed).max(MATERIAL_REF_MAX_CHARS, keyed),
    name: z.string(keyed).trim().min(1, keyed).max(NAME_MAX_CHARS, keyed).optional(),
    onHandKg: z.number(keyed).min(-STOCK_MAX_KG, keyed).max(STOCK_MAX_KG, keyed),
    reorderLevelKg: z.number(keyed).min(0, keyed).max(STOCK_MAX_KG, keyed).nullable().default(null),
    pricePerKg: z.number(keyed).min(0, keyed).max(PRICE_MAX_PER_KG, keyed).nullable().default(null),
  },
  keyed,
);

export type StockLine = z.input<typeof stockLineSchema>;

export interface PurchaseLine {
  material: string;
  name: string;
  /** Sum of the planned estimates' kg of this material. */
  neededKg: number;
  onHandKg: number;
  /** On hand after the planned work: onHand − needed. */
  afterKg: number;
  reorderLevelKg: number;
  /** max(0, needed + reorder level − on hand): enough for the planned work, leaving the reorder level in stock. */
  toBuyKg: number;
  pricePerKg: number | null;
  cost: number | null;
  /** On hand is already below the reorder level. */
  belowReorderNow: boolean;
  /** On hand after the planned work falls below the reorder level. */
  belowReorderAfter: boolean;
}

export interface PurchaseList {
  lines: PurchaseLine[];
  totalToBuyKg: number;
  /** Σ toBuy × price; null when a material to buy has no price. */
  cost: number | null;
  pricesMissing: string[];
  /** Materials whose stock after the planned work falls below their reorder level. */
  belowReorder: string[];
}

/**
 * What to buy for the planned estimates: needed kg per material = Σ of their byMaterial kg; toBuy =
 * max(0, needed + reorder level − on hand) (never negative; with no reorder level, the shortfall); cost from
 * prices per kg when every material to buy has one. Materials match by their `material` key exactly; lines in
 * stock order, then materials needed but not stocked (in order of first need, on hand 0).
 */
export function purchaseList(
  estimates: readonly { byMaterial: readonly { material: string; kg: number }[] }[],
  stock: readonly StockLine[],
): PurchaseList {
  const needed = new Map<string, number>();
  for (const estimate of estimates) {
    for (const m of estimate.byMaterial) needed.set(m.material, (needed.get(m.material) ?? 0) + m.kg);
  }
  const stocked = new Map(stock.map((s) => [s.material, s]));
  const order = [...stock.map((s) => s.material), ...[...needed.keys()].filter((m) => !stocked.has(m))];
  const lines = [...new Set(order)].map((material): PurchaseLine => {
    const s = stocked.get(material);
    const neededKg = needed.get(material) ?? 0;
    const onHandKg = s?.onHandKg ?? 0;
    const reorderLevelKg = s?.reorderLevelKg ?? 0;
    const pricePerKg = s?.pricePerKg ?? null;
    const toBuyKg = Math.max(0, neededKg + reorderLevelKg - onHandKg);
    return {
      material,
      name: s?.name ?? material,
      neededKg,
      onHandKg,
      afterKg: onHandKg - neededKg,
      reorderLevelKg,
      toBuyKg,
      pricePerKg,
      cost: pricePerKg === null ? null : toBuyKg * pricePerKg,
      belowReorderNow: onHandKg < reorderLevelKg,
      belowReorderAfter: onHandKg - neededKg < reorderLevelKg,
    };
  });
  const pricesMissing = lines.filter((l) => l.toBuyKg > 0 && l.pricePerKg === null).map((l) => l.material);
  return {
    lines,
    totalToBuyKg: lines.reduce((sum, l) => sum + l.toBuyKg, 0),
    cost: pricesMissing.length === 0 ? lines.reduce((sum, l) => sum + (l.cost ?? 0), 0) : null,
    pricesMissing,
    belowReorder: lines.filter((l) => l.belowReorderAfter).map((l) => l.material),
  };
}
