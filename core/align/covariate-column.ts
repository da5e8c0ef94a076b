import { InputError } from '../errors';
import type { Trials } from '../model/types';

/** A trial covariate column, or an input error listing those that exist. */
export function covariateColumn(trials: Trials, name: string): Float64Array | readonly string[] {
  const col = trials.covariates[name];
  if (!col) {
    const have = Object.keys(trials.covariates);
    throw new InputError({
      file: 'trials.csv',
      column: name,
      problem: 'no such trial covariate',
      fix: have.length ? `use one of ${have.join(', ')}` : 'the trial table has no covariate columns',
    });
  }
  return col;
}
