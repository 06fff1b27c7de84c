/**
 * Per-poll error metrics of Veracast (METHODS §0–5, SPEC §4): a pure core that
 * takes plain data and returns plain data. Start at `computePollMetrics`.
 */
export * from './shares';
export * from './reference-pair';
export * from './undecided';
export * from './margin';
export * from './mosteller';
export * from './mtk';
export * from './arzheimer-evans';
export * from './sampling';
export * from './coverage';
export * from './days-out';
export * from './poll-metrics';
