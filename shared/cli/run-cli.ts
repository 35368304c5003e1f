import { isDomainError } from '../src/errors';
import { commandHelp, type CommandSyntax } from './arguments';
import { analyzeCommand, analyzeSummary, analyzeSyntax } from './commands/analyze';
import { ladderCommand, ladderSummary, ladderSyntax } from './commands/ladder';
import { netlistCommand, netlistSummary, netlistSyntax } from './commands/netlist';
import { simulateCommand, simulateSummary, simulateSyntax } from './commands/simulate';
import { sizeCommand, sizeSummary, sizeSyntax } from './commands/size';
import { sizeDriverCommand, sizeDriverSummary, sizeDriverSyntax } from './commands/size-driver';
import { spreadCommand, spreadSummary, spreadSyntax } from './commands/spread';

/** A command takes its arguments and returns what to print; it throws DomainError on bad input. */
export interface CliCommand {
  syntax: CommandSyntax;
  summary: string;
  run: (argv: ReadonlyArray<string>) => string;
}

/** The command registry: one import and one entry per command. */
export const commands: Readonly<Record<string, CliCommand>> = {
  analyze: { syntax: analyzeSyntax, summary: analyzeSummary, run: analyzeCommand },
  ladder: { syntax: ladderSyntax, summary: ladderSummary, run: ladderCommand },
  size: { syntax: sizeSyntax, summary: sizeSummary, run: sizeCommand },
  'size-driver': { syntax: sizeDriverSyntax, summary: sizeDriverSummary, run: sizeDriverCommand },
  spread: { syntax: spreadSyntax, summary: spreadSummary, run: spreadCommand },
  simulate: { syntax: simulateSyntax, summary: simulateSummary, run: simulateCommand },
  netlist: { syntax: netlistSyntax, summary: netlistSummary, run: netlistCommand },
};

/** `--help`: every command with every option it takes. */
export function usage(): string {
  return [
    'Usage: ladderwright <command> [arguments] [options]   (ladderwright <command> --help: one command)',
    'Values accept SI prefixes: 4.7n, 4n7, 2k2, 25 kHz, 1.5 kV.',
    '',
    ...Object.values(commands).map((c) => `${commandHelp(c.syntax, c.summary)}\n`),
  ].join('\n');
}

export interface CliOutput {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
}

/** Runs one command line; returns the exit code (0 done, 1 bad input, 2 bad usage). */
export function runCli(argv: ReadonlyArray<string>, out: CliOutput): number {
  const [name, ...rest] = argv;
  if (!name || name === '--help' || name === '-h' || name === 'help') {
    out.stdout(`${usage()}\n`);
    return name ? 0 : 2;
  }
  const command = commands[name];
  if (!command) {
    out.stderr(`ladderwright: unknown command "${name}"\n${usage()}\n`);
    return 2;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    out.stdout(`${commandHelp(command.syntax, command.summary)}\n`);
    return 0;
  }
  try {
    out.stdout(`${command.run(rest)}\n`);
    return 0;
  } catch (error) {
    if (isDomainError(error)) {
      const issues =
        error.issues.length > 0 ? error.issues : [{ path: error.field ?? '(input)', message: error.message }];
      for (const issue of issues) out.stderr(`ladderwright: ${error.code}: ${issue.path}: ${issue.message}\n`);
      return 1;
    }
    throw error;
  }
}
