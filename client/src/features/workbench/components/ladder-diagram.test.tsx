import { fireEvent, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { type Design, designExamples } from '@ladderwright/shared/designs';
import { analyzeDesign } from '@ladderwright/shared/analysis';
import { formatQuantity } from '@ladderwright/shared/units';
import { renderWithApp } from '../../../testing/render';
import { LadderDiagram } from './ladder-diagram';

describe('LadderDiagram', () => {
  it('labels every capacitor top node with the engine’s mean node voltage and every capacitor with its value', () => {
    const design = designExamples.detectorBias as Design;
    const report = analyzeDesign(design);
    renderWithApp(<LadderDiagram report={report} design={design} />);
    const drawn = [...document.querySelectorAll('[data-schematic] text')].map((text) => text.textContent);
    const ladderNodes = report.analysis.nodes.filter((n) => n.capacitorIndex !== null);
    expect(ladderNodes).toHaveLength(report.analysis.capacitors.length);
    for (const node of ladderNodes) expect(drawn).toContain(formatQuantity(node.meanV, 'V', 3));
    for (const capacitor of report.analysis.capacitors)
      expect(drawn).toContain(`C${capacitor.index} ${formatQuantity(capacitor.valueF, 'F', 3)}`);
  });

  it('shows the engine’s node-voltage method in the diagram’s info popover, as listed among the report’s methods', async () => {
    const design = designExamples.detectorBias as Design;
    const report = analyzeDesign(design);
    expect(report.methods).toContainEqual(report.analysis.nodeMethod);
    renderWithApp(<LadderDiagram report={report} design={design} />);
    fireEvent.click(screen.getByRole('button', { name: 'How each node voltage is computed' }));
    expect(await screen.findByText(report.analysis.nodeMethod.methodId)).toBeTruthy();
    expect(screen.getByText(report.analysis.nodeMethod.summary)).toBeTruthy();
  });

  it('fits the drawing to the column by default, scaled down and never up, and shows it at full size on request', () => {
    const design = designExamples.detectorBias as Design;
    renderWithApp(<LadderDiagram report={analyzeDesign(design)} design={design} />);
    const svg = document.querySelector<SVGSVGElement>('[data-schematic]')!;
    expect(svg.dataset.fitted).toBe('true');
    expect(svg.style.maxWidth).toBe('100%');
    // The attributes keep the drawing's own size, which the export writes.
    expect(Number(svg.getAttribute('width'))).toBeGreaterThan(0);
    fireEvent.click(screen.getByRole('radio', { name: 'Full size' }));
    expect(svg.dataset.fitted).toBe('false');
    expect(svg.style.maxWidth).toBe('');
    expect(svg.parentElement!.style.overflowX).toBe('auto');
  });
});
