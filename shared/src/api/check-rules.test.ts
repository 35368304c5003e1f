import { describe, expect, it } from 'vitest';
import { analyzeDesign } from '../analysis';
import { designExamples, validateDesign } from '../designs';
import { expandCheckList, expandCheckRules, packCheckLists, packCheckRules } from './check-rules';

const reports = Object.entries(designExamples).map(([name, design]) => ({
  name,
  report: analyzeDesign(validateDesign(design)),
}));

describe('check rules sent once', () => {
  it.each(reports)('$name: gives back the report as computed after a JSON round trip', ({ report }) => {
    const sent = JSON.parse(JSON.stringify(packCheckRules(report))) as ReturnType<typeof packCheckRules>;
    expect(expandCheckRules(sent)).toEqual(JSON.parse(JSON.stringify(report)));
  });

  it.each(reports)('$name: names every rule by key and gives each text once', ({ report }) => {
    const sent = packCheckRules(report);
    const texts = Object.values(sent.checkRules);
    expect(new Set(texts).size).toBe(texts.length);
    const checks = [...sent.checks, ...(sent.driver?.checks ?? []), ...(sent.transformer?.checks ?? [])];
    for (const check of checks) {
      expect(check).not.toHaveProperty('rule');
      expect(sent.checkRules[check.ruleKey]).toBeDefined();
    }
  });

  it('sends a many-cell ladder’s Checks in a third less text or better', () => {
    const report = reports.find((entry) => entry.name === 'ionizerBar')!.report;
    const inline = JSON.stringify(report.checks).length;
    const sent = packCheckRules(report);
    // The ionizer's 20 capacitors repeat each stress rule 20 times: about 32 kB inline, 18 kB with the map.
    expect(JSON.stringify(sent.checks).length + JSON.stringify(sent.checkRules).length).toBeLessThan((2 / 3) * inline);
  });

  it('leaves a report with its rules inline (stored before the map) as it is', () => {
    const report = reports[0]!.report;
    expect(expandCheckRules(report)).toBe(report);
  });

  it('packs two sides of a comparison against one map', () => {
    const a = reports[0]!.report.checks;
    const b = reports[1]!.report.checks;
    const sent = packCheckLists(a, b);
    expect(expandCheckList(sent.a, sent.rules)).toEqual(a);
    expect(expandCheckList(sent.b, sent.rules)).toEqual(b);
  });
});
