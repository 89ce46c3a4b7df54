/**
 * Command-line arguments: positional words, `--flag value` / `--flag=value`
 * options, and boolean switches. Switches are declared by the caller so that
 * `--json` never swallows the next word.
 */
export interface ParsedArgs {
  readonly positionals: readonly string[];
  readonly options: Readonly<Record<string, string>>;
  readonly switches: ReadonlySet<string>;
  /** Options given without a value (a trailing `--volume-ml`, or an empty `--volume-ml=`). */
  readonly missingValues: readonly string[];
  /** Options given more than once, with every value typed (none is chosen silently). */
  readonly repeated: Readonly<Record<string, readonly string[]>>;
}

export function parseArgs(argv: readonly string[], switchNames: readonly string[]): ParsedArgs {
  const positionals: string[] = [];
  const options: Record<string, string> = {};
  const switches = new Set<string>();
  const missingValues: string[] = [];
  const seen: Record<string, string[]> = {};
  const setOption = (flag: string, value: string) => {
    if (value.trim() === '') {
      missingValues.push(flag);
      return;
    }
    (seen[flag] ??= []).push(value);
    options[flag] = value;
  };
  for (let index = 0; index < argv.length; index += 1) {
    const word = argv[index]!;
    if (!word.startsWith('--') || word === '--') {
      positionals.push(word);
      continue;
    }
    const equals = word.indexOf('=');
    const flag = equals >= 0 ? word.slice(0, equals) : word;
    if (switchNames.includes(flag)) {
      switches.add(flag);
      continue;
    }
    if (equals >= 0) {
      setOption(flag, word.slice(equals + 1));
      continue;
    }
    const next = argv[index + 1];
    // A negative number is a value, not a flag.
    if (next === undefined || (next.startsWith('--') && !/^--?\d/.test(next))) {
      missingValues.push(flag);
      continue;
    }
    setOption(flag, next);
    index += 1;
  }
  const repeated = Object.fromEntries(Object.entries(seen).filter(([, values]) => values.length > 1));
  return { positionals, options, switches, missingValues, repeated };
}

/**
 * Problems every command refuses before it runs: an option given twice (a pharmacist
 * could read the first value while the tool used the last). One sentence per flag.
 *
 * @example repeatedOptionProblems(parseArgs(['--seed', '1', '--seed', '2'], [])) → ['--seed: given 2 times ("1", "2"); give it once.']
 */
export function repeatedOptionProblems(args: ParsedArgs): string[] {
  return Object.entries(args.repeated).map(([flag, values]) => `${flag}: given ${values.length} times (${values.map((it) => `"${it}"`).join(', ')}); give it once.`);
}

/** `-o FILE` arrives as two positionals (the parser reads only --flags); take it out. */
export function splitOutput(positionals: readonly string[], problems: string[]): { rest: string[]; output: string | undefined } {
  const rest: string[] = [];
  let output: string | undefined;
  for (let index = 0; index < positionals.length; index += 1) {
    const word = positionals[index]!;
    if (word === '-o') {
      output = positionals[index + 1];
      if (output === undefined) problems.push('-o: a file name is missing after the flag.');
      index += 1;
    } else {
      rest.push(word);
    }
  }
  return { rest, output };
}
