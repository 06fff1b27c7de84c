import { ROLES, type Role, type User, type UserUpdate } from '@veracast/shared-types';
import { createContext, use, useMemo, type ReactNode } from 'react';
import { Alert, DataTable, LoadingState, Switch, createDataTableColumnHelper } from '../../../components/ui';
import { describeError, isApiError } from '../../../lib/api-client';
import { formatDate } from '../../../utils/format';
import { ROLE_LABELS } from '../../../utils/roles';
import { useUpdateUser } from '../api/update-user';
import { useUsers } from '../api/list-users';

interface UserRowActions {
  currentUserId: number | null;
  pendingUserId: number | null;
  update: (user: User, changes: UserUpdate) => void;
}

const UserRowActionsContext = createContext<UserRowActions | null>(null);

function useRowActions(): UserRowActions {
  const actions = use(UserRowActionsContext);
  if (!actions) throw new Error('UsersTable cells need UserRowActionsContext');
  return actions;
}

function NameCell({ user }: { user: User }) {
  const { currentUserId } = useRowActions();
  return (
    <span>
      {user.name}
      {user.id === currentUserId && <span className="ml-2 text-xs font-medium text-ink-500">(you)</span>}
    </span>
  );
}

function RoleCell({ user }: { user: User }) {
  const { pendingUserId, update } = useRowActions();
  return (
    <select
      aria-label={`Role of ${user.email}`}
      value={user.role}
      disabled={pendingUserId === user.id}
      onChange={(event) => update(user, { role: event.target.value as Role })}
      className="h-8 rounded-md border border-ink-300 bg-white px-2 text-sm focus-visible:outline-2 focus-visible:outline-accent-600"
    >
      {ROLES.map((role) => (
        <option key={role} value={role}>
          {ROLE_LABELS[role]}
        </option>
      ))}
    </select>
  );
}

function DisabledCell({ user }: { user: User }) {
  const { pendingUserId, update } = useRowActions();
  return (
    <Switch
      label={`Account of ${user.email} disabled`}
      checked={user.disabled}
      disabled={pendingUserId === user.id}
      stateLabels={{ on: 'Disabled', off: 'Active' }}
      onCheckedChange={(disabled) => update(user, { disabled })}
    />
  );
}

const column = createDataTableColumnHelper<User>();
const columns = column.columns([
  column.accessor('email', { header: 'E-mail address' }),
  column.accessor('name', { header: 'Name', cell: (info) => <NameCell user={info.row.original} /> }),
  column.accessor('role', {
    header: 'Role',
    sortFn: (a, b) => ROLES.indexOf(a.original.role) - ROLES.indexOf(b.original.role),
    cell: (info) => <RoleCell user={info.row.original} />,
  }),
  column.accessor('disabled', {
    header: 'Disabled',
    sortFn: 'basic',
    cell: (info) => <DisabledCell user={info.row.original} />,
  }),
  column.accessor('createdAt', { header: 'Created', sortFn: 'datetime', cell: (info) => formatDate(info.getValue()) }),
]);

function updateErrorMessage(error: unknown): ReactNode {
  if (isApiError(error) && error.code === 'last_admin') {
    return 'That change would leave Veracast without an active administrator. Make someone else an admin first.';
  }
  return describeError(error);
}

export interface UsersTableProps {
  /** Marks the signed-in user's own row. */
  currentUserId?: number | null;
  /** Called after a change is saved, e.g. to refresh the signed-in user's own record. */
  onUserUpdated?: (user: User) => void;
}

export function UsersTable({ currentUserId = null, onUserUpdated }: UsersTableProps) {
  const users = useUsers();
  const mutation = useUpdateUser({ onUpdated: onUserUpdated });
  const { mutate, reset } = mutation;
  const pendingUserId = mutation.isPending ? mutation.variables.id : null;

  const actions = useMemo<UserRowActions>(
    () => ({
      currentUserId,
      pendingUserId,
      update: (user, changes) => {
        reset();
        mutate({ id: user.id, changes });
      },
    }),
    [currentUserId, pendingUserId, mutate, reset],
  );

  if (users.isPending) return <LoadingState label="Loading users…" />;
  if (users.isError) return <Alert tone="danger">{describeError(users.error)}</Alert>;

  return (
    <UserRowActionsContext value={actions}>
      <div className="space-y-3">
        {mutation.isError && (
          <Alert tone="danger" title="The change was not saved">
            {updateErrorMessage(mutation.error)}
          </Alert>
        )}
        {mutation.isSuccess && (
          <Alert tone="success">
            Saved: {mutation.data.email} is {ROLE_LABELS[mutation.data.role]}
            {mutation.data.disabled ? ', account disabled' : ', account active'}.
          </Alert>
        )}
        <DataTable
          caption="Users"
          columns={columns}
          data={users.data.items}
          getRowId={(row) => String(row.id)}
          searchLabel="Search users"
          initialSorting={[{ id: 'email', desc: false }]}
          emptyMessage="No users yet."
        />
      </div>
    </UserRowActionsContext>
  );
}
