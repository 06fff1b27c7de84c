import { z } from 'zod';
import {
  auditCreateSchema,
  contestInputSchema,
  electionInputSchema,
  orientationSchema,
  pollInputSchema,
  pollsterInputSchema,
  resultInputSchema,
  apiTokenCreateSchema,
  invitationAcceptSchema,
  invitationCreateSchema,
  loginRequestSchema,
  noteCorrectionSchema,
  noteCreateSchema,
  notePreviewSchema,
  notePublishSchema,
  noteReturnSchema,
  noteUpdateSchema,
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
  '/imports/results': { post: { summary: 'Import certified or provisional results (CSV, SPEC §3); 201 summary, 422 row errors', role: 'analyst', multipart: true, query: ['dryRun', 'validOnly'] } },
  '/imports/polls': { post: { summary: 'Import polls (CSV, long or wide layout); 201 summary, 422 row errors', role: 'analyst', multipart: true, query: ['dryRun', 'validOnly', 'layout'] } },
  '/imports': { get: { summary: 'Every import with who ran it, counts and errors', role: 'viewer', query: ['format'] } },
  '/imports/{id}': { get: { summary: 'One import with its row errors', role: 'viewer', params: ['id'] } },
  '/imports/{id}/errors': { get: { summary: 'Row errors of an import (CSV with ?format=csv)', role: 'viewer', params: ['id'], query: ['format'] } },
  '/elections': {
    get: { summary: 'Elections with certification state and poll counts', role: 'viewer', query: ['format'] },
    post: { summary: 'Create an election', role: 'analyst', body: electionInputSchema },
  },
  '/elections/{electionKey}': {
    get: { summary: 'An election with its contests and quality warnings', role: 'viewer', params: ['electionKey'] },
    patch: { summary: 'Edit an election', role: 'analyst', params: ['electionKey'] },
  },
  '/elections/{electionKey}/orientation': { put: { summary: "Set the election's orientation blocs", role: 'reviewer', params: ['electionKey'], body: orientationSchema } },
  '/contests': { post: { summary: 'Create a contest with its options', role: 'analyst', body: contestInputSchema } },
  '/contests/{contestKey}': { get: { summary: 'A contest: certified result, options and change history', role: 'viewer', params: ['contestKey'] } },
  '/contests/{contestKey}/polls': { get: { summary: "The contest's polls, each with its metrics", role: 'viewer', params: ['contestKey'], query: ['undecided', 'format'] } },
  '/contests/{contestKey}/result': { put: { summary: 'Enter or change a result (certifying needs reviewer and a source; changing a certified one needs a reason)', role: 'analyst', params: ['contestKey'], body: resultInputSchema } },
  '/contests/{contestKey}/source-document': {
    get: { summary: 'Download the uploaded source document', role: 'viewer', params: ['contestKey'] },
    post: { summary: 'Upload the certifying source document (PDF, PNG or JPEG)', role: 'reviewer', params: ['contestKey'], multipart: true },
  },
  '/polls': {
    get: { summary: 'Polls, filtered by contest, election or pollster', role: 'viewer', query: ['contest', 'election', 'pollster', 'format'] },
    post: { summary: 'Create a poll with its shares', role: 'analyst', body: pollInputSchema },
  },
  '/polls/{pollKey}': {
    get: { summary: 'A poll with its inputs and metrics under each undecided treatment', role: 'viewer', params: ['pollKey'] },
    put: { summary: 'Edit a poll', role: 'analyst', params: ['pollKey'], body: pollInputSchema },
  },
  '/pollsters': {
    get: { summary: 'Polling firms with aliases, sponsors and disclosure completeness', role: 'viewer', query: ['format'] },
    post: { summary: 'Create a pollster with aliases', role: 'analyst', body: pollsterInputSchema },
  },
  '/pollsters/{id}': {
    get: { summary: 'A pollster with its polls', role: 'viewer', params: ['id'] },
    patch: { summary: 'Edit a pollster and its aliases', role: 'analyst', params: ['id'] },
  },
  '/quality': { get: { summary: 'Data-quality warnings', role: 'viewer', query: ['election', 'format'] } },
  '/audits': {
    get: { summary: 'Audits', role: 'viewer', query: ['format'] },
    post: { summary: 'Create a frozen audit', role: 'analyst', body: auditCreateSchema },
  },
  '/audits/{id}': { get: { summary: 'An audit: settings, data hash, headline, out-of-date flag', role: 'viewer', params: ['id'] } },
  '/audits/{id}/rerun': { post: { summary: 'Re-run an audit with the current data (a new audit)', role: 'analyst', params: ['id'] } },
  '/audits/{id}/polls': { get: { summary: 'Per-poll metrics of the audit', role: 'viewer', params: ['id'], query: ['election', 'pollster', 'inWindow', 'isFinal', 'used', 'format'] } },
  '/audits/{id}/scorecards': { get: { summary: 'Pollster scorecards with intervals and ranks', role: 'viewer', params: ['id'], query: ['elections', 'kind', 'modes', 'populations', 'sponsorTypes', 'minPolls', 'format'] } },
  '/audits/{id}/shared-error': { get: { summary: 'Shared-error analysis of one election', role: 'viewer', params: ['id'], query: ['election', 'format', 'part'] } },
  '/audits/{id}/breakdowns': { get: { summary: 'Error breakdowns by timing and source', role: 'viewer', params: ['id'] } },
  '/audits/{id}/history': { get: { summary: 'Shared miss per election and the interval history supports for a poll average', role: 'viewer', params: ['id'] } },
});

describeRoutes({
  '/notes': {
    get: { summary: 'Methodology notes (viewers see notes in review or published)', role: 'viewer', query: ['state', 'author', 'election', 'format'] },
    post: { summary: 'Create a draft note (version 1)', role: 'analyst', body: noteCreateSchema },
  },
  '/notes/preview': { post: { summary: 'Render Markdown with live blocks to sanitised HTML, marking out-of-date audits', role: 'analyst', body: notePreviewSchema } },
  '/notes/{id}': {
    get: { summary: 'A note with its current version, reviews and cited audits', role: 'viewer', params: ['id'] },
    put: { summary: 'Save a draft as a new version (author or admin)', role: 'analyst', body: noteUpdateSchema, params: ['id'] },
  },
  '/notes/{id}/versions': { get: { summary: 'Every version of a note', role: 'viewer', params: ['id'] } },
  '/notes/{id}/versions/{n}': { get: { summary: 'One version with its Markdown and rendered HTML', role: 'viewer', params: ['id', 'n'] } },
  '/notes/{id}/submit': { post: { summary: 'Submit a draft for review (author); e-mails the reviewers', role: 'analyst', params: ['id'] } },
  '/notes/{id}/return': { post: { summary: 'Return a note in review to draft with comments (a reviewer who is not the author)', role: 'reviewer', body: noteReturnSchema, params: ['id'] } },
  '/notes/{id}/publish': { post: { summary: 'Approve and publish a note in review (a reviewer who is not the author)', role: 'reviewer', body: notePublishSchema, params: ['id'] } },
  '/notes/{id}/corrections': { post: { summary: 'Publish a correction as a new version with a notice (author or reviewer)', role: 'analyst', body: noteCorrectionSchema, params: ['id'] } },
  '/public/notes': { get: { summary: 'Published notes (no sign-in)' } },
  '/public/notes/{slug}': { get: { summary: 'A published note: frozen HTML, data hashes, corrections and cautions (no sign-in)', params: ['slug'] } },
  '/public/notes/{slug}/pdf': { get: { summary: 'The published note as a PDF (no sign-in)', params: ['slug'] } },
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
