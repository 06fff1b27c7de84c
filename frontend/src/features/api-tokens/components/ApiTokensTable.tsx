import type { ApiToken } from '@veracast/shared-types';
import { createContext, use, useMemo, useState } from 'react';
import { Alert, Button, DataTable, LoadingState, createDataTableColumnHelper } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { formatDateTime } from '../../../utils/format';
import { useApiTokens } from '../api/list-api-tokens';
import { useRevokeApiToken } from '../api/revoke-api-token';

interface TokenRowActions {
  pendingId: number | null;
  revoke: (token: ApiToken) => void;
}
const TokenRowActionsContext = createContext<TokenRowActions | null>(null);

function RevokeCell({ token }: { token: ApiToken }) {
  const actions = use(TokenRowActionsContext);
  const [confirming, setConfirming] = useState(false);
  if (!actions) throw new Error('ApiTokensTable cells need TokenRowActionsContext');
  if (token.revokedAt) return <span className="text-ink-500">Revoked {formatDateTime(token.revokedAt)}</span>;
  if (!confirming) {
    return (
      <Button variant="secondary" size="sm" onClick={() => setConfirming(true)} aria-label={`Revoke token ${token.name}`}>
        Revoke
      </Button>
    );
  }
  return (
    <span className="inline-flex items-center gap-2">
      <Button
        variant="danger"
        size="sm"
        busy={actions.pendingId === token.id}
        busyText="Revoking…"
        onClick={() => actions.revoke(token)}
        aria-label={`Confirm: revoke token ${token.name}`}
      >
        Confirm revoke
      </Button>
      <Button variant="ghost" size="sm" onClick={() => setConfirming(false)}>
        Cancel
      </Button>
    </span>
  );
}

const column = createDataTableColumnHelper<ApiToken>();
const columns = column.columns([
  column.accessor('name', { header: 'Name' }),
  column.accessor('prefix', {
    header: 'Starts with',
    cell: (info) => <code className="font-mono text-xs">{info.getValue()}…</code>,
  }),
  column.accessor('createdAt', { header: 'Created', sortFn: 'datetime', cell: (info) => formatDateTime(info.getValue()) }),
  column.accessor((row) => row.lastUsedAt ?? '', {
    id: 'lastUsedAt',
    header: 'Last used',
    cell: (info) => (info.row.original.lastUsedAt ? formatDateTime(info.row.original.lastUsedAt) : 'Never'),
  }),
  column.accessor((row) => (row.revokedAt ? 'Revoked' : 'Active'), { id: 'status', header: 'Status' }),
  column.display({
    id: 'actions',
    header: () => <span className="sr-only">Actions</span>,
    cell: (info) => <RevokeCell token={info.row.original} />,
  }),
]);

export function ApiTokensTable() {
  const tokens = useApiTokens();
  const revoke = useRevokeApiToken();
  const { mutate } = revoke;
  const pendingId = revoke.isPending ? revoke.variables : null;
  const actions = useMemo<TokenRowActions>(() => ({ pendingId, revoke: (token) => mutate(token.id) }), [pendingId, mutate]);

  if (tokens.isPending) return <LoadingState label="Loading tokens…" />;
  if (tokens.isError) return <Alert tone="danger">{describeError(tokens.error)}</Alert>;

  return (
    <TokenRowActionsContext value={actions}>
      <div className="space-y-3">
        {revoke.isError && (
          <Alert tone="danger" title="The token was not revoked">
            {describeError(revoke.error)}
          </Alert>
        )}
        <DataTable
          caption="Your API tokens"
          columns={columns}
          data={tokens.data.items}
          getRowId={(row) => String(row.id)}
          initialSorting={[{ id: 'createdAt', desc: true }]}
          emptyMessage="You have no API tokens."
        />
      </div>
    </TokenRowActionsContext>
  );
}
