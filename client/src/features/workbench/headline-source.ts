// Loaded apart from the Workbench's first paint: only a revision with a stored simulation needs the comparison.
export { headlineSource } from '@ladderwright/shared/analysis';
