import { Alert, Stat, StatGroup } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { useHealth } from '../api/get-health';

export function HealthStatus() {
  const health = useHealth();

  if (health.isPending) return <p className="text-sm text-ink-600">Checking the service…</p>;
  if (health.isError) {
    return (
      <Alert tone="danger" title="The service did not answer">
        {describeError(health.error)}
      </Alert>
    );
  }

  const { status, database, version } = health.data;
  return (
    <StatGroup columns={3}>
      <Stat label="Service" value={status === 'ok' ? 'Working' : 'Degraded'} hint={status === 'ok' ? undefined : 'Some requests may fail.'} />
      <Stat label="Database" value={database === 'up' ? 'Reachable' : 'Unreachable'} />
      <Stat label="Version" value={<span className="font-mono text-lg">{version}</span>} />
    </StatGroup>
  );
}
