export { analyzeDesign, analyzeLadderReport, evaluateChecks, resolveDrive, ladderInputOf } from './analyze-design';
export type { DesignReport, LadderReport, LadderReportOptions } from './analyze-design';
