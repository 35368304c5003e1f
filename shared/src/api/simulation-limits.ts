/**
 * Bounds of a simulation job's options, as the API accepts them (the DTO) and the forms check them before
 * sending. Driver designs: the push-button start-up window in seconds.
 */
export const START_UP_WINDOW_S = { min: 1e-4, max: 0.1 } as const;
