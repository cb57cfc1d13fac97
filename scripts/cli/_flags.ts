/**
 * Flag handling shared by the commands in scripts/cli/ (the dispatcher skips files starting with "_").
 * Every error names the flag, so the message on stderr tells the user what to change.
 */
import { parseArgs, type ParseArgsConfig } from 'node:util';

type FlagOptions = NonNullable<ParseArgsConfig['options']>;
type StrictConfig<O extends FlagOptions> = { args: string[]; options: O; strict: true; allowPositionals: false };

/** The message text of anything thrown. */
export function errorMessage(err: unknown): string {
  return err instanceof Error ? err.message : String(err);
}

/** Strict `parseArgs` without positionals; a parse error (unknown flag, missing value) gets the usage appended. */
export function parseFlags<const O extends FlagOptions>(
  argv: string[],
  options: O,
  usage: string,
): ReturnType<typeof parseArgs<StrictConfig<O>>>['values'] {
  try {
    return parseArgs<StrictConfig<O>>({ args: argv, options, strict: true, allowPositionals: false }).values;
  } catch (err) {
    throw new Error(`${errorMessage(err)}; ${usage}`, { cause: err });
  }
}

/** The error for a required flag that was not given. */
export function missingFlagError(name: string, usage: string): Error {
  return new Error(`missing required flag --${name}; ${usage}`);
}

/** The raw value of a required flag, or the missing-flag error with the usage. */
export function requiredFlag(name: string, raw: string | undefined, usage: string): string {
  if (raw === undefined) throw missingFlagError(name, usage);
  return raw;
}

/** `Number(raw)`, except that a blank value is NaN (Number('') is 0). */
function numberOf(raw: string): number {
  return raw.trim() === '' ? Number.NaN : Number(raw);
}

/** A flag value as a finite number; undefined stays undefined (an optional flag not given). */
export function finiteNumberFlag(name: string, raw: string): number;
export function finiteNumberFlag(name: string, raw: string | undefined): number | undefined;
export function finiteNumberFlag(name: string, raw: string | undefined): number | undefined {
  if (raw === undefined) return undefined;
  const value = numberOf(raw);
  if (!Number.isFinite(value)) throw new Error(`--${name} must be a finite number, got "${raw}"`);
  return value;
}

/**
 * A flag value as a finite number > 0; undefined stays undefined. `expected` is the wording of the error
 * ("--name must be <expected>, got …"), which the fit command words as "a positive number".
 */
export function positiveNumberFlag(name: string, raw: string, expected?: string): number;
export function positiveNumberFlag(name: string, raw: string | undefined, expected?: string): number | undefined;
export function positiveNumberFlag(name: string, raw: string | undefined, expected = 'a finite number > 0'): number | undefined {
  if (raw === undefined) return undefined;
  const value = numberOf(raw);
  if (!Number.isFinite(value) || value <= 0) throw new Error(`--${name} must be ${expected}, got "${raw}"`);
  return value;
}

/** A comma-separated list of finite numbers > 0 (blanks around commas allowed, empty items not). */
export function positiveNumberListFlag(name: string, raw: string): number[] {
  return raw.split(',').map((part) => {
    const value = numberOf(part);
    if (!Number.isFinite(value) || value <= 0) {
      throw new Error(`--${name} must be a comma-separated list of finite numbers > 0, got "${raw}"`);
    }
    return value;
  });
}

/** Maps each value of a list flag; an error thrown for one value is prefixed with the flag and that value. */
export function mapListFlag<T>(name: string, values: number[], fn: (value: number) => T): T[] {
  return values.map((value) => {
    try {
      return fn(value);
    } catch (err) {
      throw new Error(`--${name} ${value}: ${errorMessage(err)}`, { cause: err });
    }
  });
}

/** `--repulsive-exponent`: λr of the Mie λr-6 potential, a number from 8 to 36 (default 12, the LJ 12-6 potential). */
export function repulsiveExponentFlag(raw: string | undefined): number {
  if (raw === undefined) return 12;
  const value = numberOf(raw);
  if (!Number.isFinite(value) || value < 8 || value > 36)
    throw new Error(`--repulsive-exponent must be a number from 8 to 36, got "${raw}"`);
  return value;
}
