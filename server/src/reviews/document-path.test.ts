import { hasPath } from './document-path';

const document = { multiplier: { capacitors: [{ valueF: 1e-9 }, { valueF: 2e-9 }], cellCount: 2 }, name: 'x' };

describe('hasPath', () => {
  it.each([
    ['name', true],
    ['multiplier.cellCount', true],
    ['multiplier.capacitors[1].valueF', true],
    ['multiplier.capacitors[2].valueF', false],
    ['multiplier.capacitors.valueF', false],
    ['multiplier.diode', false],
    ['constructor', false],
    ['multiplier..cellCount', false],
    ['', false],
  ])('answers %s -> %s', (path, expected) => {
    expect(hasPath(document, path)).toBe(expected);
  });
});
