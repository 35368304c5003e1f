// Makes start-up-curves.ngspice.json: ngspice's push-button start-up of each case in START_UP_CASES, read as
// cycle means at the case's times (`ngspiceStartUp`), with the deck it ran. Not a test (each run takes
// seconds to tens of seconds of CPU); run it again when the netlist exporter or the driver circuit changes
// (the start-up test refuses a stored deck that differs from the exporter's):
//   npx tsx shared/test/calibration/references/make-start-up-references.ts
import { execFileSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { ngspiceStartUp } from '../synthetic-bench';
import { caseDeck, caseDesign, START_UP_CASES, START_UP_REFERENCE_FILE, type StartUpReference } from './start-up-cases';

async function main(): Promise<void> {
  const version = /ngspice-\S+/.exec(execFileSync('ngspice', ['--version'], { encoding: 'utf8' }))?.[0] ?? 'unknown';
  const curves: StartUpReference['curves'] = [];
  for (const entry of START_UP_CASES) {
    const points = await ngspiceStartUp(caseDesign(entry), entry.periods, entry.count);
    curves.push({ ...entry, deck: caseDeck(entry), points });
    console.log(`${entry.key}: last cycle mean ${points[points.length - 1]!.y.toFixed(3)} V`);
  }
  const reference: StartUpReference = {
    about:
      'ngspice push-button start-ups of the demo tester driver (ladder capacitors 470 pF), one parameter at a known value: the mean of v(top) over each cycle between turn-on marks, interpolated at the times x (s), volts',
    ngspiceVersion: version,
    command: 'ngspice -b circuit.cir (wrdata of v(col) v(vcc) i(vt1_lp_sense) v(top))',
    curves,
  };
  writeFileSync(path.join(__dirname, START_UP_REFERENCE_FILE), `${JSON.stringify(reference)}\n`);
  console.log(`wrote ${START_UP_REFERENCE_FILE} (${version})`);
}

void main();
