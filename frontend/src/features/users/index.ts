export { userKeys } from './api/keys';
export { listUsers, usersQueryOptions, useUsers } from './api/list-users';
export { updateUser, updateUserInputSchema, useUpdateUser, type UpdateUserInput } from './api/update-user';
export { UsersTable, type UsersTableProps } from './components/UsersTable';
