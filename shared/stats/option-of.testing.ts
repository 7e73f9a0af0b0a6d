import { OptionError } from './options';

/** For specs: the option an OptionError names when `run` throws one (fails when nothing, or something else, is thrown). */
export function optionOf(run: () => unknown): string {
  try {
    run();
  } catch (error) {
    if (error instanceof OptionError) return error.option;
    throw error;
  }
  throw new Error('no OptionError thrown');
}
