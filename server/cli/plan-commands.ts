/**
 * The planning commands of `npm run analyze` (no CSV: a plan comes before data):
 *   plan-comparison --settings PLAN.json   simulate a method comparison over a grid of n (shared/stats/plan-comparison.ts)
 *   plan-transference --n 20 --max-outside 2 --outside 0.025,0.05,0.1,0.2 [--retest 20]
 *   plan-establish [--n 120,240] [--percentiles 2.5,97.5] [--level 0.9] [--shape normal --lower L --upper U]
 */
import { OptionError } from '@shared/stats/options';
import { planComparison } from '@shared/stats/plan-comparison';
import { planEstablish } from '@shared/stats/plan-establish';
import { planTransference } from '@shared/stats/plan-transference';
import { FlagError, flagFor, integerFlag, listFlag, numberFlag, parseFlags, textFlag, type FlagSpec } from './flags';
import { readSettings } from './study-kinds';

interface PlanCommand { flags: FlagSpec; run(options: Record<string, unknown>): unknown }

export const PLAN_COMMANDS: Record<string, PlanCommand> = {
  'plan-comparison': {
    flags: { '--settings': ['settings', textFlag] },
    run(options) {
      if (options.settings === undefined) throw new FlagError('--settings PLAN.json is required');
      const plan = readSettings(options.settings as string);
      try {
        return planComparison(plan);
      } catch (error) {
        if (error instanceof OptionError) throw new FlagError(`${options.settings as string}: ${error.option} ${error.message.replace(/^option \S+ /, '')}`);
        throw error;
      }
    },
  },
  'plan-transference': {
    flags: { '--n': ['n', integerFlag], '--max-outside': ['maxOutside', integerFlag], '--retest': ['retest', integerFlag], '--outside': ['outside', listFlag] },
    run: (options) => {
      const r = planTransference(options);
      return { kind: r.kind, rows: r.rows, n: r.n, maxOutside: r.maxOutside, retest: r.retest };
    },
  },
  'plan-establish': {
    flags: {
      '--n': ['n', listFlag], '--percentiles': ['percentiles', listFlag], '--level': ['level', numberFlag],
      '--shape': ['shape', textFlag], '--lower': ['lower', numberFlag], '--upper': ['upper', numberFlag],
    },
    run: ({ shape, lower, upper, ...rest }) =>
      planEstablish({ ...rest, population: shape === undefined && lower === undefined && upper === undefined ? null : { shape: shape as 'normal', lower: lower as number, upper: upper as number } }),
  },
};

/** Runs a plan command; an OptionError names the flag (or the settings field). */
export function runPlanCommand(name: string, args: string[]): unknown {
  const command = PLAN_COMMANDS[name];
  const options = parseFlags(args, command.flags);
  try {
    return command.run(options);
  } catch (error) {
    if (error instanceof OptionError) {
      const flag = flagFor(command.flags, error.option.replace(/^population\./, ''));
      throw new FlagError(`${flag.startsWith('--') ? flag : `--${flag}`}: ${error.message.replace(/^option \S+ /, '')}`);
    }
    throw error;
  }
}
