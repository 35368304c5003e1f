import { execFile, execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';

const execFileAsync = promisify(execFile);

/** True when an `ngspice` executable answers on this machine. */
export function hasNgspice(): boolean {
  try {
    execFileSync('ngspice', ['--version'], { stdio: 'pipe' });
    return true;
  } catch {
    return false;
  }
}

export interface NgspiceTrace {
  timeS: Float64Array;
  signals: Record<string, Float64Array>;
  elapsedMs: number;
}

/**
 * Runs a netlist (which must contain its `.tran` line and no `.end`-less control) in ngspice batch mode
 * and reads the listed vectors (e.g. 'v(out)', 'i(vs)') through `wrdata` as ASCII columns.
 */
export async function runNgspice(netlist: string, vectors: ReadonlyArray<string>): Promise<NgspiceTrace> {
  const dir = mkdtempSync(join(tmpdir(), 'lw-ngspice-'));
  try {
    const dataPath = join(dir, 'out.data');
    const control = [
      '.control',
      'set wr_singlescale',
      'set wr_vecnames',
      'set numdgt=12',
      'run',
      `wrdata ${dataPath} ${vectors.join(' ')}`,
      '.endc',
    ];
    const text = netlist.replace(/^\.end\s*$/m, `${control.join('\n')}\n.end`);
    const cirPath = join(dir, 'circuit.cir');
    writeFileSync(cirPath, text);
    const started = performance.now();
    // In batch mode ngspice exits with 1 when the netlist has no .print line, even after a good run;
    // the data file is the evidence of success.
    let failure: unknown = null;
    await execFileAsync('ngspice', ['-b', cirPath], { cwd: dir, maxBuffer: 64 * 1024 * 1024 }).catch((e: unknown) => {
      failure = e;
    });
    if (!existsSync(dataPath)) throw new Error(`ngspice wrote no data: ${String(failure)}`);
    const elapsedMs = performance.now() - started;
    const lines = readFileSync(dataPath, 'utf8').trim().split('\n');
    const rows = lines.slice(1).map((l) => l.trim().split(/\s+/).map(Number));
    const timeS = Float64Array.from(rows, (r) => r[0]!);
    const signals: Record<string, Float64Array> = {};
    vectors.forEach((v, i) => {
      signals[v] = Float64Array.from(rows, (r) => r[i + 1]!);
    });
    return { timeS, signals, elapsedMs };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/**
 * The scale and vectors of an ngspice binary raw file (`set filetype=binary`, `write FILE vectors`) of a real
 * analysis: a text header, then per point one double per variable. 16 bytes a point for one vector, where a
 * `wrdata` line takes about 40, so a long transient stays cheap to read back.
 */
export function readBinaryRaw(raw: Buffer): { timeS: Float64Array; vectors: Float64Array[] } {
  const marker = raw.indexOf('Binary:\n');
  const header = raw.subarray(0, marker).toString('latin1');
  const variables = Number(/No\. Variables:\s*(\d+)/.exec(header)![1]);
  const points = Number(/No\. Points:\s*(\d+)/.exec(header)![1]);
  const start = raw.byteOffset + marker + 'Binary:\n'.length;
  const data = new Float64Array(raw.buffer.slice(start, start + points * variables * 8));
  const column = (v: number): Float64Array => Float64Array.from({ length: points }, (_, p) => data[p * variables + v]!);
  return { timeS: column(0), vectors: Array.from({ length: variables - 1 }, (_, v) => column(v + 1)) };
}
