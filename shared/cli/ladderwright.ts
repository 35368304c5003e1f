import { isDomainError } from '../src/errors';
import { analyzeCommand, analyzeHelp } from './commands/analyze';
import { ladderCommand, ladderHelp } from './commands/ladder';
import { netlistCommand } from './commands/netlist';
import { simulateCommand } from './commands/simulate';
import { sizeCommand, sizeHelp } from './commands/size';
import { sizeDriverCommand, sizeDriverHelp } from './commands/size-driver';
import { spreadCommand, spreadHelp } from './commands/spread';
import { LADDER_FLAGS_HELP } from './ladder-flags';

/** A command takes its arguments and returns what to print; it throws DomainError on bad input. */
export interface CliCommand {
  help: string;
  run: (argv: ReadonlyArray<string>) => string;
}

/** The command registry: one import and one entry per command. */
export const commands: Readonly<Record<string, CliCommand>> = {
  analyze: { help: analyzeHelp, run: analyzeCommand },
  ladder: { help: ladderHelp, run: ladderCommand },
  size: { help: sizeHelp, run: sizeCommand },
  'size-driver': { help: sizeDriverHelp, run: sizeDriverCommand },
  spread: { help: spreadHelp, run: spreadCommand },
  simulate: { help: 'simulate DESIGN.json | ladder flags   time-domain run (simulator)', run: simulateCommand },
  netlist: { help: 'netlist DESIGN.json | ladder flags    SPICE netlist (simulator)', run: netlistCommand },
};

function usage(): string {
  return [
    'Usage: ladderwright <command> [arguments]',
    ...Object.values(commands).map((c) => `  ${c.help}`),
    'Ladder flags:',
    LADDER_FLAGS_HELP,
  ].join('\n');
}

function main(argv: ReadonlyArray<string>): number {
  const [name, ...rest] = argv;
  if (!name || name === '--help' || name === 'help') {
    process.stdout.write(`${usage()}\n`);
    return name ? 0 : 2;
  }
  const command = commands[name];
  if (!command) {
    process.stderr.write(`ladderwright: unknown command "${name}"\n${usage()}\n`);
    return 2;
  }
  try {
    process.stdout.write(`${command.run(rest)}\n`);
    return 0;
  } catch (error) {
    if (isDomainError(error)) {
      const issues =
        error.issues.length > 0 ? error.issues : [{ path: error.field ?? '(input)', message: error.message }];
      for (const issue of issues)
        process.stderr.write(`ladderwright: ${error.code}: ${issue.path}: ${issue.message}\n`);
      return 1;
    }
    throw error;
  }
}

process.exitCode = main(process.argv.slice(2));
