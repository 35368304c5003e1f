import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { cycleMeans } from '../../shared/test/ngspice/cycle-means';
import { readBinaryRaw } from '../../shared/test/ngspice/run-ngspice';

/** `times` prints the shell's user/system times, then its children's: "0m1.234s 0m0.056s". */
function childrenCpuMs(timesOutput: string): number {
  const children = timesOutput.trim().split('\n').pop()!.trim().split(/\s+/);
  const seconds = (t: string): number => {
    const m = /^(\d+)m([\d.]+)s$/.exec(t);
    return m ? 60 * Number(m[1]) + Number(m[2]) : NaN;
  };
  return 1000 * (seconds(children[0]!) + seconds(children[1]!));
}

/** CPU time (user + system) of one ngspice batch run of the netlist, from bash's `times` for its children. */
export function ngspiceCpuMs(netlist: string): number {
  const dir = mkdtempSync(join(tmpdir(), 'lw-ngspice-cpu-'));
  try {
    const path = join(dir, 'circuit.cir');
    writeFileSync(path, netlist.replace(/^\.end\s*$/m, '.control\nrun\n.endc\n.end'));
    const out = execFileSync('bash', ['-c', 'ngspice -b "$1" >/dev/null 2>&1; times', 'bash', path], {
      encoding: 'utf8',
    });
    return childrenCpuMs(out);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export interface TimedNgspiceRun {
  timeS: Float64Array;
  signals: Record<string, Float64Array>;
  wallMs: number;
  cpuMs: number;
}

/**
 * One ngspice batch run that both writes the listed vectors (through `wrdata`) and is timed (wall clock, and CPU
 * from bash's `times`): a long run is paid for once, not once for the answer and again for the time.
 */
export function runNgspiceTimed(netlist: string, vectors: ReadonlyArray<string>): TimedNgspiceRun {
  const dir = mkdtempSync(join(tmpdir(), 'lw-ngspice-timed-'));
  try {
    const dataPath = join(dir, 'out.data');
    const control = ['.control', 'set wr_singlescale', 'set wr_vecnames', 'set numdgt=12', 'run'];
    control.push(`wrdata ${dataPath} ${vectors.join(' ')}`, '.endc');
    const cirPath = join(dir, 'circuit.cir');
    writeFileSync(cirPath, netlist.replace(/^\.end\s*$/m, `${control.join('\n')}\n.end`));
    const started = performance.now();
    const out = execFileSync('bash', ['-c', 'ngspice -b "$1" >/dev/null 2>&1; times', 'bash', cirPath], {
      cwd: dir,
      encoding: 'utf8',
    });
    const wallMs = performance.now() - started;
    if (!existsSync(dataPath)) throw new Error('ngspice wrote no data');
    const rows = readFileSync(dataPath, 'utf8')
      .trim()
      .split('\n')
      .slice(1)
      .map((line) => line.trim().split(/\s+/).map(Number));
    const signals: Record<string, Float64Array> = {};
    vectors.forEach((vector, i) => {
      signals[vector] = Float64Array.from(rows, (row) => row[i + 1]!);
    });
    return { timeS: Float64Array.from(rows, (row) => row[0]!), signals, wallMs, cpuMs: childrenCpuMs(out) };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export interface NgspiceCycleMeans {
  /** Mean of the vector over each whole period [c·T, (c + 1)·T]. */
  means: Float64Array;
  wallMs: number;
  cpuMs: number;
}

/**
 * One timed ngspice batch run of a transient that keeps only `vector` (`.save`, so a long run does not hold every
 * node) and writes it as a binary raw file; returns its cycle means. Long runs (millions of points) stay cheap
 * to read back: 16 bytes a point instead of a text line.
 */
export function runNgspiceCycleMeans(
  netlist: string,
  vector: string,
  periodS: number,
  cycles: number,
): NgspiceCycleMeans {
  const dir = mkdtempSync(join(tmpdir(), 'lw-ngspice-means-'));
  try {
    const rawPath = join(dir, 'out.raw');
    const control = ['.control', 'set filetype=binary', 'run', `write ${rawPath} ${vector}`, '.endc'];
    const cirPath = join(dir, 'circuit.cir');
    writeFileSync(cirPath, netlist.replace(/^\.end\s*$/m, `.save ${vector}\n${control.join('\n')}\n.end`));
    const started = performance.now();
    const out = execFileSync('bash', ['-c', 'ngspice -b "$1" >/dev/null 2>&1; times', 'bash', cirPath], {
      cwd: dir,
      encoding: 'utf8',
    });
    const wallMs = performance.now() - started;
    if (!existsSync(rawPath)) throw new Error('ngspice wrote no data');
    const { timeS, vectors } = readBinaryRaw(readFileSync(rawPath));
    const values = vectors[0]!;
    return { means: cycleMeans(timeS, values, periodS, cycles), wallMs, cpuMs: childrenCpuMs(out) };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
