/** The surplus-production models, by name: adding a model is one module and one line here. */
import type { ProductionModel } from './production-model';
import { schaefer } from './schaefer';
import { pellaTomlinson } from './pella-tomlinson';
import { fox } from './fox';
import { allee } from './allee';
import { predation } from './predation';

export const PRODUCTION_MODELS = {
  schaefer,
  'pella-tomlinson': pellaTomlinson,
  fox,
  allee,
  predation,
} as const satisfies Record<string, ProductionModel>;

export type SurplusModelName = keyof typeof PRODUCTION_MODELS;

export const SURPLUS_MODEL_NAMES = Object.keys(PRODUCTION_MODELS) as SurplusModelName[];

/** The model of this name; throws for an unknown name. */
export function productionModel(name: string): ProductionModel {
  const m = (PRODUCTION_MODELS as Record<string, ProductionModel>)[name];
  if (!m) throw new Error(`unknown production model "${name}"`);
  return m;
}
