import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** CPU time (user + system) of one ngspice batch run of the netlist, from bash's `times` for its children. */
export function ngspiceCpuMs(netlist: string): number {
  const dir = mkdtempSync(join(tmpdir(), 'lw-ngspice-cpu-'));
  try {
    const path = join(dir, 'circuit.cir');
    writeFileSync(path, netlist.replace(/^\.end\s*$/m, '.control\nrun\n.endc\n.end'));
    const out = execFileSync('bash', ['-c', 'ngspice -b "$1" >/dev/null 2>&1; times', 'bash', path], {
      encoding: 'utf8',
    });
    // `times` prints the shell's user/system times, then its children's: "0m1.234s 0m0.056s".
    const children = out.trim().split('\n').pop()!.trim().split(/\s+/);
    const seconds = (t: string): number => {
      const m = /^(\d+)m([\d.]+)s$/.exec(t);
      return m ? 60 * Number(m[1]) + Number(m[2]) : NaN;
    };
    return 1000 * (seconds(children[0]!) + seconds(children[1]!));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
