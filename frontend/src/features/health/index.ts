export { healthKeys } from './api/keys';
export { getHealth, healthQueryOptions, useHealth } from './api/get-health';
export { HealthStatus } from './components/HealthStatus';
