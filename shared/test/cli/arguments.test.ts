import { describe, expect, it } from 'vitest';
import { commands, runCli, usage } from '../../cli/run-cli';

// The command line in-process: what it refuses and how it says so, and the help it prints.

function cli(...argv: string[]): { code: number; stdout: string; stderr: string } {
  let stdout = '';
  let stderr = '';
  const code = runCli(argv, { stdout: (t) => (stdout += t), stderr: (t) => (stderr += t) });
  return { code, stdout, stderr };
}

const ladder = ['--stages', '2', '--peak', '1k', '--freq', '50', '--cap', '10n'];

describe('ladderwright arguments', () => {
  it('refuses a misspelt option and names it', () => {
    const run = cli('ladder', ...ladder, '--laod-current', '5m');
    expect(run.code).toBe(1);
    expect(run.stderr).toContain('unknown option --laod-current');
    expect(run.stdout).toBe('');
  });

  it('refuses a stray value after an option value (the unit split off "--cap 10 nF")', () => {
    const run = cli('ladder', '--stages', '2', '--peak', '1k', '--freq', '50', '--cap', '10', 'nF');
    expect(run.code).toBe(1);
    expect(run.stderr).toContain('unexpected value "nF"');
  });

  it('refuses a stray value where a design file is allowed, when ladder options are given too', () => {
    for (const command of ['simulate', 'netlist']) {
      const run = cli(command, '--stages', '2', '--peak', '1k', '--freq', '50', '--cap', '10', 'nF');
      expect(run.code, command).toBe(1);
      expect(run.stderr, command).toContain('unexpected value "nF"');
    }
  });

  it('refuses --until other than steady', () => {
    const run = cli('simulate', ...ladder, '--until', 'forever');
    expect(run.code).toBe(1);
    expect(run.stderr).toContain('--until takes "steady", not "forever"');
  });

  it('refuses an option without its value and a switch given one', () => {
    expect(cli('ladder', ...ladder, '--bleeder').stderr).toContain('--bleeder needs a value');
    expect(cli('ladder', ...ladder, '--negative=yes').stderr).toContain('--negative takes no value');
  });

  it('refuses a second design file', () => {
    const run = cli('analyze', 'a.json', 'b.json');
    expect(run.code).toBe(1);
    expect(run.stderr).toContain('unexpected value "b.json"');
  });

  it('takes a value that starts with a minus sign and a digit as the option value', () => {
    const run = cli('ladder', '--stages', '2', '--peak', '-1k', '--freq', '50', '--cap', '10n');
    expect(run.stderr).not.toContain('needs a value');
    expect(run.stderr).not.toContain('unexpected value');
  });

  it('still runs a well-formed command', () => {
    const run = cli('ladder', ...ladder, '--load-current', '1u');
    expect(run.code).toBe(0);
    expect(JSON.parse(run.stdout)).toHaveProperty('outputMeanV');
  });

  it('--help lists every option of every command', () => {
    const run = cli('--help');
    expect(run.code).toBe(0);
    expect(run.stdout).toBe(`${usage()}\n`);
    for (const [name, command] of Object.entries(commands)) {
      expect(run.stdout).toContain(`ladderwright ${name}`);
      for (const option of Object.keys(command.syntax.options)) expect(run.stdout).toContain(`--${option}`);
    }
  });

  it('<command> --help lists that command only', () => {
    const run = cli('spread', '--help');
    expect(run.code).toBe(0);
    expect(run.stdout).toContain('--trials');
    expect(run.stdout).not.toContain('ladderwright ladder');
  });
});
