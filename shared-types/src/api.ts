/** Error body of every failed request (SPEC §7). */
export interface ApiErrorBody {
  error: { code: string; message: string; details?: unknown };
}
/** Every list endpoint answers `{ items, total }` (and CSV with `?format=csv`). */
export interface ListResponse<T> {
  items: T[];
  total: number;
}
export interface HealthResponse {
  status: 'ok' | 'degraded';
  database: 'up' | 'down';
  version: string;
}
export const API_PREFIX = '/api/v1';
export const CSRF_HEADER = 'X-CSRF-Token';
