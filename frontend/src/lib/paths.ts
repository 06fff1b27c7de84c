/**
 * Every route of the app in one typed map: `path` is the router pattern, `href(...)` builds a link.
 */
function encode(segment: string | number): string {
  return encodeURIComponent(String(segment));
}

function withQuery(base: string, query: Record<string, string | undefined>): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value !== undefined && value !== '') params.set(key, value);
  const text = params.toString();
  return text ? `${base}?${text}` : base;
}

export const paths = {
  home: { path: '/', href: () => '/' },

  signIn: {
    path: '/sign-in',
    /** `next` is where to go after signing in; `notice` shows a short message (see SIGN_IN_NOTICES). */
    href: (options: { next?: string; notice?: SignInNotice } = {}) =>
      withQuery('/sign-in', { next: options.next, notice: options.notice }),
  },
  resetPasswordRequest: { path: '/reset-password', href: () => '/reset-password' },
  resetPasswordConfirm: {
    path: '/reset-password/:token',
    href: (token: string) => `/reset-password/${encode(token)}`,
  },
  invitation: { path: '/invite/:token', href: (token: string) => `/invite/${encode(token)}` },

  elections: { path: '/elections', href: () => '/elections' },
  election: { path: '/elections/:electionKey', href: (electionKey: string) => `/elections/${encode(electionKey)}` },
  /** A contest's page: certified result, its history, and the polls against it. */
  contest: { path: '/contests/:contestKey', href: (contestKey: string) => `/contests/${encode(contestKey)}` },
  pollsters: { path: '/pollsters', href: () => '/pollsters' },
  pollster: { path: '/pollsters/:pollsterId', href: (pollsterId: number | string) => `/pollsters/${encode(pollsterId)}` },
  audits: { path: '/audits', href: () => '/audits' },
  /** `filters` are the scorecard filters as search parameters (elections, kind, modes, …). */
  auditRankings: {
    path: '/audits/:id/rankings',
    href: (id: number | string, filters: Record<string, string | undefined> = {}) =>
      withQuery(`/audits/${encode(id)}/rankings`, filters),
  },
  auditBreakdowns: { path: '/audits/:id/breakdowns', href: (id: number | string) => `/audits/${encode(id)}/breakdowns` },
  /** A firm's accuracy in one audit (the newest when `audit` is absent). */
  pollsterAccuracy: {
    path: '/pollsters/:id/accuracy',
    href: (id: number | string, options: { audit?: number | string } = {}) =>
      withQuery(`/pollsters/${encode(id)}/accuracy`, { audit: options.audit === undefined ? undefined : String(options.audit) }),
  },
  auditNew: { path: '/audits/new', href: () => '/audits/new' },
  audit: { path: '/audits/:auditId', href: (auditId: number | string) => `/audits/${encode(auditId)}` },
  /** A poll's own page; `treatment` marks the undecided treatment the reader came from. */
  poll: {
    path: '/polls/:pollKey',
    href: (pollKey: string, options: { treatment?: string } = {}) =>
      withQuery(`/polls/${encode(pollKey)}`, { treatment: options.treatment }),
  },
  /** Every formula with its source; `anchor` jumps to one metric, e.g. `margin-error`. */
  methods: { path: '/methods', href: (anchor?: string) => (anchor ? `/methods#${encode(anchor)}` : '/methods') },
  /** Chooses an audit and an election; `audit` preselects an audit. */
  sharedError: {
    path: '/shared-error',
    href: (options: { audit?: number | string } = {}) =>
      withQuery('/shared-error', { audit: options.audit === undefined ? undefined : String(options.audit) }),
  },
  /** The shared-error analysis of one election of an audit. */
  auditSharedError: {
    path: '/audits/:id/shared-error/:electionKey',
    href: (id: number | string, electionKey: string) => `/audits/${encode(id)}/shared-error/${encode(electionKey)}`,
  },
  /** Across the audit's elections: the shared miss of each and the archive's interval for a poll average. */
  auditHistory: { path: '/audits/:id/history', href: (id: number | string) => `/audits/${encode(id)}/history` },
  imports: { path: '/imports', href: () => '/imports' },
  importRecord: { path: '/imports/:importId', href: (importId: number | string) => `/imports/${encode(importId)}` },
  notes: { path: '/notes', href: () => '/notes' },
  noteNew: { path: '/notes/new', href: () => '/notes/new' },
  /** A note: its current version, review and correction (the review view). */
  note: { path: '/notes/:noteId', href: (noteId: number | string) => `/notes/${encode(noteId)}` },
  noteEdit: { path: '/notes/:noteId/edit', href: (noteId: number | string) => `/notes/${encode(noteId)}/edit` },
  /** Two versions side by side; `a` and `b` are version numbers. */
  noteVersions: {
    path: '/notes/:noteId/versions',
    href: (noteId: number | string, options: { a?: number; b?: number } = {}) =>
      withQuery(`/notes/${encode(noteId)}/versions`, { a: options.a === undefined ? undefined : String(options.a), b: options.b === undefined ? undefined : String(options.b) }),
  },
  /** A published note, readable without signing in. */
  publicNote: { path: '/public/notes/:slug', href: (slug: string) => `/public/notes/${encode(slug)}` },
  /** `election` narrows the checks to one election. */
  dataQuality: {
    path: '/data-quality',
    href: (options: { election?: string } = {}) => withQuery('/data-quality', { election: options.election }),
  },

  apiTokens: { path: '/settings/api-tokens', href: () => '/settings/api-tokens' },

  adminUsers: { path: '/admin/users', href: () => '/admin/users' },
  adminMailbox: { path: '/admin/mailbox', href: () => '/admin/mailbox' },
  adminMailMessage: {
    path: '/admin/mailbox/:messageId',
    href: (messageId: number | string) => `/admin/mailbox/${encode(messageId)}`,
  },
} as const;

export const SIGN_IN_NOTICES = {
  'signed-out': 'You have signed out.',
  'password-reset': 'Your password has been changed. Sign in with the new one.',
  'account-ready': 'Your account is ready. Sign in with the e-mail address and password you chose.',
  'session-expired': 'Your session has ended. Sign in again to continue.',
} as const;
export type SignInNotice = keyof typeof SIGN_IN_NOTICES;

export function isSignInNotice(value: string | null): value is SignInNotice {
  return value !== null && Object.hasOwn(SIGN_IN_NOTICES, value);
}

/**
 * Accepts a post-sign-in destination only when it is a path inside this app, so a crafted
 * `?next=https://elsewhere` link cannot send a user off-site.
 */
export function safeNextPath(next: string | null | undefined, fallback: string = paths.home.href()): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  if (next === paths.signIn.path || next.startsWith(`${paths.signIn.path}?`)) return fallback;
  return next;
}
