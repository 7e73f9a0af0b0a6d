/**
 * `npm run --silent analyze -- KIND FILE.csv [options]`: reads a CSV with a header row, runs one analysis of
 * shared/stats and prints its result as one JSON object on stdout. KIND: comparison | interval |
 * verify-interval | bootstrap-test, with the engine's options as flags; or a study kind by its stored name
 * (method-comparison | interval-establish | interval-verify | precision | …, from the kinds' registry) with
 * `--settings FILE.json`, the study's settings object, run exactly as a stored study is (study-kinds.ts).
 * Planning (no data file): plan-comparison --settings PLAN.json, plan-transference, plan-establish (plan-commands.ts).
 * A bad file or option prints one line naming the row or option on stderr and exits with status 2.
 */
import { readFileSync } from 'node:fs';
import { OptionError } from '@shared/stats';
import { CsvError, parseCsv } from './csv';
import { FlagError, flagFor, parseFlags, textFlag } from './flags';
import { KINDS, type Kind } from './kinds';
import { readSettings, runStudyKind, STUDY_KIND_NAMES } from './study-kinds';
import { PLAN_COMMANDS, runPlanCommand } from './plan-commands';

const USAGE = `usage: npm run --silent analyze -- ${Object.keys(KINDS).join('|')} FILE.csv [--option value ...]\n` +
  `   or: npm run --silent analyze -- ${STUDY_KIND_NAMES.join('|')} FILE.csv [--settings SETTINGS.json]\n` +
  `   or: npm run --silent analyze -- plan-comparison --settings PLAN.json | plan-transference --n 20 --max-outside 2 --outside 0.025,0.1 | plan-establish --n 120,240`;

/** A study kind on the command line: its only flag is the settings file. */
const studyKind = (name: string): Kind => ({
  flags: { '--settings': ['settings', textFlag] },
  run: (table, options) => runStudyKind(name, table, options.settings === undefined ? {} : readSettings(options.settings as string)),
});

export function main(argv: string[]): number {
  if (PLAN_COMMANDS[argv[0] ?? '']) return plan(argv[0], argv.slice(1));
  const [kindName, file, ...rest] = argv;
  const kind = KINDS[kindName ?? ''] ?? (STUDY_KIND_NAMES.includes(kindName ?? '') ? studyKind(kindName) : undefined);
  if (!kind || !file) return fail(kindName && !kind ? `unknown analysis kind "${kindName}"; ${USAGE}` : USAGE);
  try {
    const options = parseFlags(rest, kind.flags);
    let text: string;
    try {
      text = readFileSync(file, 'utf8');
    } catch (error) {
      return fail(`cannot read ${file}: ${(error as NodeJS.ErrnoException).code ?? String(error)}`);
    }
    const result = kind.run(parseCsv(text), options);
    process.stdout.write(`${JSON.stringify(result, null, 2)}\n`);
    return 0;
  } catch (error) {
    if (error instanceof OptionError) return fail(`${flagFor(kind.flags, error.option)}: ${error.message.replace(/^option \S+ /, '')}`);
    if (error instanceof CsvError || error instanceof FlagError || error instanceof RangeError) return fail(error.message);
    throw error;
  }
}

/** A planning command: no data file, flags only. */
function plan(name: string, args: string[]): number {
  try {
    process.stdout.write(`${JSON.stringify(runPlanCommand(name, args), null, 2)}\n`);
    return 0;
  } catch (error) {
    if (error instanceof FlagError || error instanceof RangeError) return fail(error.message);
    throw error;
  }
}

function fail(message: string): number {
  process.stderr.write(`analyze: ${message.replace(/\s+/g, ' ')}\n`);
  return 2;
}

if (require.main === module) process.exitCode = main(process.argv.slice(2));
