// Makes deep-droop-80-stages.ngspice.json: ngspice's transient of the 80-stage deep-droop cascade from empty
// capacitors, every cycle's mean of the ladder top. Not a test (it takes minutes of CPU); run it again when the
// netlist exporter or the ladder circuit changes:
//   npx tsx shared/test/ngspice/references/make-deep-droop-reference.ts [cycles]
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { toSpiceNetlist } from '../../../src/sim/to-spice-netlist';
import { cycleMeans } from '../cycle-means';
import { readBinaryRaw } from '../run-ngspice';
import {
  deepDroopCircuit,
  DEEP_DROOP_FREQUENCY_HZ,
  DEEP_DROOP_REFERENCE_FILE,
  DEEP_DROOP_STEPS_PER_PERIOD,
} from './deep-droop-ladder';

const cycles = Number(process.argv[2] ?? 9000);
const periodS = 1 / DEEP_DROOP_FREQUENCY_HZ;
const netlist = toSpiceNetlist(deepDroopCircuit(), {
  transient: { stopTimeS: cycles * periodS, maxStepS: periodS / DEEP_DROOP_STEPS_PER_PERIOD },
});
const dir = mkdtempSync(path.join(tmpdir(), 'lw-deep-droop-'));
try {
  const rawPath = path.join(dir, 'out.raw');
  const control = ['.control', 'set filetype=binary', 'run', `write ${rawPath} v(top)`, '.endc'];
  const deck = netlist.replace(/^\.end\s*$/m, `.save v(top)\n${control.join('\n')}\n.end`);
  writeFileSync(path.join(dir, 'circuit.cir'), deck);
  const command = 'ngspice -b circuit.cir';
  // In batch mode ngspice exits with 1 when the deck has no .print line, even after a good run: the raw file is
  // the evidence.
  execFileSync('bash', ['-c', `${command} > /dev/null 2>&1 || true`], { cwd: dir });
  const version = /ngspice-\S+/.exec(execFileSync('ngspice', ['--version'], { encoding: 'utf8' }))?.[0] ?? 'unknown';
  const { timeS, vectors } = readBinaryRaw(readFileSync(rawPath));
  const means = Array.from(cycleMeans(timeS, vectors[0]!, periodS, cycles), (mean) => Math.round(mean * 100) / 100);
  const reference = {
    about:
      'ngspice transient of the 80-stage deep-droop half-wave cascade from empty capacitors: the mean of v(top) over each drive cycle, volts, rounded to 10 mV',
    ngspiceVersion: version,
    command,
    deck,
    cycles,
    cycleMeansV: means,
  };
  writeFileSync(path.join(__dirname, DEEP_DROOP_REFERENCE_FILE), `${JSON.stringify(reference)}\n`);
  console.log(`wrote ${DEEP_DROOP_REFERENCE_FILE}: last cycle mean ${means[means.length - 1]} V (${version})`);
} finally {
  rmSync(dir, { recursive: true, force: true });
}
