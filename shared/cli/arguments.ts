import { parseArgs } from 'node:util';
import { DomainError } from '../src/errors';

/** One option of a command: a value (`--cap 10n`) or a switch (`--text`), with its line in `--help`. */
export interface OptionSpec {
  type: 'string' | 'boolean';
  /** Placeholder of the value in the help text (string options). */
  value?: string;
  help: string;
}

export type OptionTable = Readonly<Record<string, OptionSpec>>;

/** What a command accepts: its options and the positional arguments it names (e.g. ['DESIGN.json']). */
export interface CommandSyntax {
  command: string;
  options: OptionTable;
  positionals: ReadonlyArray<string>;
  /** Whether the positionals may be left out (a command that also works from flags alone). */
  positionalsOptional?: boolean;
}

/** Positional arguments and the options given, option values as text and switches as `true`. */
export interface ParsedArguments {
  positional: string[];
  flags: Map<string, string | true>;
}

const NEGATIVE_NUMBER = /^-[\d.]/;

function quoted(message: string): string {
  return /'([^']+)'/.exec(message)?.[1]?.replace(/ <value>$/, '') ?? '';
}

/**
 * Parses a command's arguments with Node's util.parseArgs in strict mode. An unknown option, a value the
 * command does not take, a missing option value or a switch given a value is refused with a DomainError
 * naming it. A value starting with a minus and a digit (`--target -6k`) is taken as the option's value.
 */
export function parseCommandArguments(argv: ReadonlyArray<string>, syntax: CommandSyntax): ParsedArguments {
  const args: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    const next = argv[i + 1];
    const spec = arg.startsWith('--') ? syntax.options[arg.slice(2)] : undefined;
    if (spec?.type === 'string' && next !== undefined && NEGATIVE_NUMBER.test(next)) {
      args.push(`${arg}=${next}`);
      i++;
    } else args.push(arg);
  }
  const help = `see ladderwright ${syntax.command} --help`;
  let parsed: ReturnType<typeof parseArgs>;
  try {
    parsed = parseArgs({
      args,
      options: Object.fromEntries(Object.entries(syntax.options).map(([name, o]) => [name, { type: o.type }])),
      strict: true,
      allowPositionals: syntax.positionals.length > 0,
    });
  } catch (error) {
    const code = (error as { code?: string }).code;
    const message = (error as Error).message;
    const name = quoted(message);
    if (code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION')
      throw new DomainError('invalid_argument', `unknown option ${name} (${help})`, name.replace(/^-+/, ''));
    if (code === 'ERR_PARSE_ARGS_UNEXPECTED_POSITIONAL')
      throw new DomainError('invalid_argument', `unexpected value "${name}" (${help})`, name);
    if (code === 'ERR_PARSE_ARGS_INVALID_OPTION_VALUE') {
      const what = message.includes('does not take an argument') ? 'takes no value' : 'needs a value';
      throw new DomainError('invalid_argument', `${name} ${what} (${help})`, name.replace(/^-+/, ''));
    }
    throw error;
  }
  const positional = parsed.positionals;
  if (positional.length > syntax.positionals.length) {
    const stray = positional.slice(syntax.positionals.length);
    throw new DomainError(
      'invalid_argument',
      `unexpected value${stray.length > 1 ? 's' : ''} ${stray.map((s) => `"${s}"`).join(', ')} (${help})`,
      stray[0],
    );
  }
  const flags = new Map<string, string | true>();
  for (const [name, value] of Object.entries(parsed.values)) {
    if (typeof value === 'string' || value === true) flags.set(name, value);
  }
  return { positional, flags };
}

/** The help block of a command: its synopsis line and one line per option. */
export function commandHelp(syntax: CommandSyntax, summary: string): string {
  const positionals = syntax.positionals.join(' ');
  const synopsis = [
    `ladderwright ${syntax.command}`,
    positionals && (syntax.positionalsOptional ? `[${positionals}]` : positionals),
    '[options]',
  ]
    .filter(Boolean)
    .join(' ');
  const lines = Object.entries(syntax.options).map(([name, o]) => {
    const flag = o.type === 'string' ? `--${name} ${o.value ?? 'VALUE'}` : `--${name}`;
    return `    ${flag.padEnd(38)} ${o.help}`;
  });
  return [`  ${synopsis}`, `      ${summary}`, ...lines].join('\n');
}
