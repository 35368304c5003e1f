/** How a figure was computed, so the Workbench can say so beside it. */
export interface MethodInfo {
  methodId: string;
  summary: string;
  assumptions: string[];
  source: string;
}

/** A number with the method that produced it. */
export interface Estimated<T = number> {
  value: T;
  method: MethodInfo;
}
