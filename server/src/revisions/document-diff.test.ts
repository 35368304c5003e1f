import { changedPaths, differences, flattenLeaves } from './document-diff';

describe('document differences', () => {
  const base = {
    name: 'Detector tube bias',
    multiplier: { cellCount: 3, capacitors: [{ valueF: 10e-9 }, { valueF: 10e-9 }, { valueF: 10e-9 }] },
    outputNetwork: { bleeder: null },
  };

  it('names leaves by dotted and indexed paths', () => {
    expect([...flattenLeaves(base).keys()]).toEqual([
      'name',
      'multiplier.cellCount',
      'multiplier.capacitors[0].valueF',
      'multiplier.capacitors[1].valueF',
      'multiplier.capacitors[2].valueF',
      'outputNetwork.bleeder',
    ]);
  });

  it('reports a changed capacitor with its numeric delta (exact: 22 nF − 10 nF in binary floating point)', () => {
    const edited = structuredClone(base);
    edited.multiplier.capacitors[1] = { valueF: 22e-9 };
    expect(differences(base, edited)).toEqual([
      { path: 'multiplier.capacitors[1].valueF', a: 10e-9, b: 22e-9, delta: 22e-9 - 10e-9 },
    ]);
  });

  it('reports added and removed leaves with null on the missing side', () => {
    const edited = { ...base, outputNetwork: { bleeder: { count: 4 } } };
    const shorter = { ...base, multiplier: { ...base.multiplier, capacitors: base.multiplier.capacitors.slice(0, 2) } };
    expect(differences(base, edited)).toEqual([{ path: 'outputNetwork.bleeder.count', a: null, b: 4 }]);
    expect(changedPaths(base, shorter)).toEqual(['multiplier.capacitors[2].valueF']);
  });

  it('finds no difference between equal documents with keys in another order', () => {
    const reordered = { outputNetwork: { bleeder: null }, multiplier: base.multiplier, name: base.name };
    expect(changedPaths(base, reordered)).toEqual([]);
  });
});
