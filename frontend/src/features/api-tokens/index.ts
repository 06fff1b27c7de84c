export { apiTokenKeys } from './api/keys';
export { apiTokensQueryOptions, listApiTokens, useApiTokens } from './api/list-api-tokens';
export { createApiToken, createApiTokenInputSchema, useCreateApiToken } from './api/create-api-token';
export { revokeApiToken, useRevokeApiToken } from './api/revoke-api-token';
export { ApiTokensTable } from './components/ApiTokensTable';
export { CreateApiTokenForm } from './components/CreateApiTokenForm';
