/**
 * `cli cascade --model ricker --params r=2.8,K=1000 [--harvest FROM:TO:STEP | --productivity FROM:TO:STEP]
 *   [--fixed-harvest U] [--max-period 64] [--diagram]`: doublings, onset of chaos and periodic windows.
 */
import { parseArgs } from 'node:util';
import { cascade } from '../discrete/cascade';
import { checkParams, DISCRETE_MODELS, discreteModel } from '../discrete/stock-recruit';
import { numberOption, parseParamList, parseRange, UsageError } from './command-args';

export function cascadeCommand(args: string[]): unknown {
  const { values: o } = parseArgs({
    args, strict: true,
    options: {
      model: { type: 'string' }, params: { type: 'string' }, harvest: { type: 'string' }, productivity: { type: 'string' },
      'fixed-harvest': { type: 'string' }, 'max-period': { type: 'string' }, diagram: { type: 'boolean' },
    },
  });
  if (!o.model || !(o.model in DISCRETE_MODELS)) throw new UsageError(`--model must be one of ${Object.keys(DISCRETE_MODELS).join(', ')}`);
  const model = discreteModel(o.model);
  const params = parseParamList(o.params, 'params');
  const bad = checkParams(model, params);
  if (bad.length) throw new UsageError(`--params: ${bad.join('; ')}`);
  if (o.harvest && o.productivity) throw new UsageError('give either --harvest or --productivity, not both');
  const ref = model.reference(params);
  const control = o.productivity ? 'productivity' : 'harvest';
  const range = o.productivity
    ? parseRange(o.productivity, 'productivity', true)
    : o.harvest ? parseRange(o.harvest, 'harvest', true) : { from: 0, to: Math.min(0.99, ref.uCollapse), step: null };
  if (control === 'harvest' && (range.from < 0 || range.to >= 1)) throw new UsageError('--harvest rates are fractions in [0, 1)');
  const steps = range.step ? Math.max(1, Math.round((range.to - range.from) / range.step)) : 200;
  if (steps > 5000) throw new UsageError('at most 5000 steps');
  const fixed = numberOption(o['fixed-harvest'], 'fixed-harvest', 0);
  if (fixed < 0 || fixed >= 1) throw new UsageError('--fixed-harvest is a fraction in [0, 1)');
  const maxPeriod = numberOption(o['max-period'], 'max-period', 64);
  if (![2, 4, 8, 16, 32, 64, 128, 256].includes(maxPeriod)) throw new UsageError('--max-period must be a power of two from 2 to 256');
  const c = cascade(model, params, { control, from: range.from, to: range.to, steps, harvest: fixed, maxPeriod });
  return {
    model: model.name, params, control, from: range.from, to: range.to, steps,
    doublings: c.doublings, periods: c.periods, deltaEstimates: c.deltaEstimates, chaosOnset: c.chaosOnset,
    cyclesWhere: c.cyclesWhere, windows: c.windows, collapseAt: c.collapseAt,
    reference: ref,
    ...(o.diagram ? { diagram: c.columns } : {}),
  };
}
