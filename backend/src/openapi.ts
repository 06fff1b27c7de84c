import { z } from 'zod';
import {
  apiTokenCreateSchema,
  invitationAcceptSchema,
  invitationCreateSchema,
  loginRequestSchema,
  passwordResetConfirmSchema,
  passwordResetRequestSchema,
  userUpdateSchema,
} from '@veracast/shared-types';
import { VERSION } from './version';

type Op = { summary: string; role?: string; body?: z.ZodType; multipart?: boolean; params?: string[]; query?: string[] };
type Ops = Record<string, Record<string, Op>>;

const routes: Ops = {};

/** Feature routers describe their operations here so the OpenAPI document stays complete. */
export function describeRoutes(ops: Ops) {
  for (const [p, methods] of Object.entries(ops)) routes[p] = { ...routes[p], ...methods };
}

describeRoutes({
  '/health': { get: { summary: 'Server and database state' } },
  '/auth/login': { post: { summary: 'Sign in; sets the session cookie', body: loginRequestSchema } },
  '/auth/logout': { post: { summary: 'Sign out' } },
  '/auth/me': { get: { summary: 'The signed-in user', role: 'viewer' } },
  '/auth/csrf': { get: { summary: 'CSRF token to send as X-CSRF-Token on unsafe cookie requests', role: 'viewer' } },
  '/auth/password-reset/request': { post: { summary: 'E-mail a one-time reset link', body: passwordResetRequestSchema } },
  '/auth/password-reset/confirm': { post: { summary: 'Set a new password with a reset token', body: passwordResetConfirmSchema } },
  '/invitations': {
    get: { summary: 'List invitations', role: 'admin' },
    post: { summary: 'Invite a person by e-mail with a role', role: 'admin', body: invitationCreateSchema },
  },
  '/invitations/{token}': { get: { summary: 'What an invitation offers (public)', params: ['token'] } },
  '/invitations/accept': { post: { summary: 'Accept an invitation: set name and password', body: invitationAcceptSchema } },
  '/users': { get: { summary: 'List users', role: 'admin' } },
  '/users/{id}': { patch: { summary: 'Change a role or disable/enable', role: 'admin', body: userUpdateSchema, params: ['id'] } },
  '/api-tokens': {
    get: { summary: 'Your API tokens', role: 'viewer' },
    post: { summary: 'Create a personal API token (shown once)', role: 'viewer', body: apiTokenCreateSchema },
  },
  '/api-tokens/{id}': { delete: { summary: 'Revoke an API token', role: 'viewer', params: ['id'] } },
  '/admin/mailbox': { get: { summary: 'Messages kept by the local fake SMTP server', role: 'admin' } },
  '/admin/mailbox/{id}': { get: { summary: 'One message of the local mailbox', role: 'admin', params: ['id'] } },
});

function jsonSchema(schema: z.ZodType) {
  try {
    return z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' });
  } catch {
    return { type: 'object' };
  }
}

/** The OpenAPI 3.1 document served at /api/v1/openapi.json. */
export function openApiDocument() {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const [p, methods] of Object.entries(routes)) {
    paths[p] = {};
    for (const [method, op] of Object.entries(methods)) {
      const parameters = [
        ...(op.params ?? []).map((name) => ({ name, in: 'path', required: true, schema: { type: 'string' } })),
        ...(op.query ?? []).map((name) => ({ name, in: 'query', required: false, schema: { type: 'string' } })),
      ];
      paths[p][method] = {
        summary: op.summary,
        ...(op.role ? { description: `Needs the ${op.role} role or above.`, security: [{ cookie: [] }, { bearer: [] }] } : {}),
        ...(parameters.length ? { parameters } : {}),
        ...(op.body ? { requestBody: { required: true, content: { 'application/json': { schema: jsonSchema(op.body) } } } } : {}),
        ...(op.multipart ? { requestBody: { required: true, content: { 'multipart/form-data': { schema: { type: 'object', properties: { file: { type: 'string', format: 'binary' } } } } } } } : {}),
        responses: { default: { description: 'JSON; errors as { error: { code, message, details } }' } },
      };
    }
  }
  return {
    openapi: '3.1.0',
    info: { title: 'Veracast API', version: VERSION, description: 'Audit pre-election polls against certified results.' },
    servers: [{ url: '/api/v1' }],
    components: {
      securitySchemes: {
        cookie: { type: 'apiKey', in: 'cookie', name: 'veracast_session' },
        bearer: { type: 'http', scheme: 'bearer' },
      },
    },
    paths,
  };
}
