import { Inject, Injectable } from '@nestjs/common';
import type { DesignReportBody, DesignTemplate, EvaluateResponse, ResultDifference } from '@ladderwright/shared/api';
import { validateDesign, type Design } from '@ladderwright/shared/designs';
import { DomainError, isDomainError, prefixedFieldPath } from '@ladderwright/shared/errors';
import { resolveDrive } from '@ladderwright/shared/analysis';
import { ENGINE_VERSION } from '@ladderwright/shared/multiplier';
import type { ShelfPart } from '@ladderwright/shared/parts';
import { DESIGN_TEMPLATES } from './design-templates';
import { EnginePoolService } from './engine-pool.service';
import type { EngineTask, EngineTaskOutcome } from './engine-task.types';

/** Runs engine tasks: the worker pool in the app, the task function itself in the demo seed. */
export interface EngineRunner {
  run(task: EngineTask): Promise<EngineTaskOutcome>;
}

/** A numeric headline figure of a report, by its path in the report. */
export interface HeadlineFigure {
  key: string;
  label: string;
  unit: string;
}

/** The report figures shown side by side when two revisions are compared. */
export const HEADLINE_FIGURES: readonly HeadlineFigure[] = [
  { key: 'noLoadOutputV', label: 'No-load output', unit: 'V' },
  { key: 'outputMeanV', label: 'Output at load (mean)', unit: 'V' },
  { key: 'outputMinV', label: 'Output at load (min)', unit: 'V' },
  { key: 'outputMaxV', label: 'Output at load (max)', unit: 'V' },
  { key: 'ripplePeakToPeakV', label: 'Ripple (peak-to-peak)', unit: 'V' },
  { key: 'droopV', label: 'Droop', unit: 'V' },
  { key: 'outputImpedanceOhm', label: 'Output impedance', unit: 'Ω' },
  { key: 'optimumStages', label: 'Optimum stage count', unit: '' },
  { key: 'textbookRippleV', label: 'Ripple, textbook closed form', unit: 'V' },
  { key: 'textbookDropV', label: 'Drop, textbook closed form', unit: 'V' },
  { key: 'analysis.ladderCurrentA', label: 'Ladder current (load plus bleeder)', unit: 'A' },
  { key: 'analysis.bleederCurrentA', label: 'Bleeder current', unit: 'A' },
  { key: 'analysis.outputPowerW', label: 'Output power', unit: 'W' },
  { key: 'storedEnergyJ', label: 'Stored energy', unit: 'J' },
  { key: 'storedChargeC', label: 'Stored charge', unit: 'C' },
  { key: 'dischargeTimeS', label: 'Discharge time to the safe voltage', unit: 's' },
];

function figureValue(report: unknown, key: string): number | null {
  let node: unknown = report;
  for (const part of key.split('.')) {
    node = typeof node === 'object' && node !== null ? (node as Record<string, unknown>)[part] : undefined;
  }
  return typeof node === 'number' && Number.isFinite(node) ? node : null;
}

/** A DomainError with its field paths under `fieldPrefix`; any other error as it is. */
function prefixed(error: unknown, fieldPrefix: string): unknown {
  if (!isDomainError(error)) return error;
  if (error.code === 'budget_exceeded') return error;
  const issues = error.issues.map((issue) => ({ ...issue, path: prefixedFieldPath(fieldPrefix, issue.path) }));
  const field = prefixedFieldPath(fieldPrefix, error.field ?? '') || fieldPrefix || null;
  const summary = issues.map((issue) => `${issue.path}: ${issue.message}`).join('; ');
  const message = issues.length > 0 ? `design is not valid: ${summary}` : error.message;
  return new DomainError(error.code, message, field, issues);
}

/**
 * The server's one door to the shared engine: validation of untrusted documents, the authoritative
 * report with the engine version, and the templates. No formula lives here.
 */
@Injectable()
export class AnalysisService {
  readonly engineVersion: string = ENGINE_VERSION;

  constructor(@Inject(EnginePoolService) private readonly engine: EngineRunner) {}

  /**
   * Validates an untrusted document. Field issues come back under `fieldPrefix`, the body field the
   * document arrived in (e.g. `document.multiplier.capacitors[1].valueF`), so the 400 names the field.
   */
  parseDocument(input: unknown, fieldPrefix: string): Design {
    return this.withFieldPrefix(fieldPrefix, () => validateDesign(input));
  }

  /** Runs an engine call; a DomainError it throws comes back with its field paths under `fieldPrefix`. */
  private withFieldPrefix<T>(fieldPrefix: string, run: () => T): T {
    try {
      return run();
    } catch (error) {
      throw prefixed(error, fieldPrefix);
    }
  }

  private async withFieldPrefixAsync<T>(fieldPrefix: string, run: () => Promise<T>): Promise<T> {
    try {
      return await run();
    } catch (error) {
      throw prefixed(error, fieldPrefix);
    }
  }

  /**
   * The engine's report on a valid document (closed-form and steady-state methods only), computed on an
   * engine worker thread within the request's time budget. With a project's `shelf`, the referenced
   * parts' ratings are filled in first (`analyzeWithShelf`) and unresolved codes come back in
   * `report.partIssues`.
   */
  async evaluate(design: Design, fieldPrefix = 'document', shelf?: readonly ShelfPart[]): Promise<EvaluateResponse> {
    const report = await this.analyze(design, fieldPrefix, shelf, 'object');
    return { engineVersion: this.engineVersion, report: report as DesignReportBody };
  }

  /**
   * `evaluate` as the UTF-8 bytes of its answer's JSON text, for routes that only send it on: the worker
   * serialises the report and encodes it, so it crosses the thread boundary as bytes and is never copied into a
   * string or serialised on this thread. The document is validated on the worker (as every engine task is), with
   * the same 400 naming the field.
   */
  async evaluateJsonBytes(document: unknown, fieldPrefix = 'document', shelf?: readonly ShelfPart[]): Promise<Buffer> {
    const answer = (await this.analyze(document as Design, fieldPrefix, shelf, 'answer-bytes')) as Uint8Array;
    return Buffer.from(answer.buffer, answer.byteOffset, answer.byteLength);
  }

  private async analyze(
    design: Design,
    fieldPrefix: string,
    shelf: readonly ShelfPart[] | undefined,
    reportAs: 'object' | 'answer-bytes',
  ): Promise<unknown> {
    const outcome = await this.withFieldPrefixAsync(fieldPrefix, () =>
      this.engine.run({ kind: 'analyze', document: design, reportAs, ...(shelf ? { shelf } : {}) }),
    );
    if (!outcome.ok) {
      const { code, message, field, issues } = outcome.error;
      return this.withFieldPrefix(fieldPrefix, () => {
        throw new DomainError(code, message, field, issues);
      });
    }
    return outcome.report;
  }

  /** The document with its secondary as the engine resolves it: a driver stage becomes its pulse estimate. */
  withResolvedDrive(design: Design): Design {
    if (design.drive.kind !== 'driver') return design;
    return { ...design, drive: resolveDrive(design).drive };
  }

  templates(): DesignTemplate[] {
    return DESIGN_TEMPLATES.map((template) => structuredClone(template));
  }

  template(id: string): DesignTemplate | null {
    const template = DESIGN_TEMPLATES.find((candidate) => candidate.id === id);
    return template ? structuredClone(template) : null;
  }

  /** Headline figures of two reports side by side; `deltaPct` is relative to |a| (null when a is 0 or missing). */
  compareFigures(reportA: DesignReportBody, reportB: DesignReportBody): ResultDifference[] {
    return HEADLINE_FIGURES.map(({ key, label, unit }) => {
      const a = figureValue(reportA, key);
      const b = figureValue(reportB, key);
      const delta = a !== null && b !== null ? b - a : null;
      const deltaPct = delta !== null && a !== null && a !== 0 ? (delta / Math.abs(a)) * 100 : null;
      return { key, label, ...(unit ? { unit } : {}), a, b, delta, deltaPct };
    });
  }
}
