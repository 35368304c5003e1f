export type { MethodInfo, Estimated } from './method.types';
