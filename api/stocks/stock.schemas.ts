/** Contract of the stocks API: shared with the client through `import type`. */
export const STOCK_KINDS = ['single', 'predator-prey'] as const;
export type StockKind = (typeof STOCK_KINDS)[number];

export interface StockView {
  id: number;
  code: string;
  name: string;
  kind: StockKind;
  unit: string;
  defaultModel: string;
  description: string | null;
  region: { id: number; code: string; name: string };
}
