import { Link } from 'react-router-dom';

export interface AccessDeniedProps {
  /** Where the "go back" link leads. */
  homeHref?: string;
}

/** Shown in place of a screen whose role requirement the signed-in user does not meet (403). */
export function AccessDenied({ homeHref = '/' }: AccessDeniedProps) {
  return (
    <div className="mx-auto max-w-xl rounded-lg border border-ink-200 bg-white px-6 py-10 text-center shadow-sm">
      <p className="text-sm font-medium text-ink-500">Error 403</p>
      <h1 className="mt-1 text-2xl font-semibold text-ink-950">You do not have access</h1>
      <p className="mt-3 text-ink-600">
        Your role does not allow this screen. If you need it, ask an administrator to change your role.
      </p>
      <Link to={homeHref} className="mt-6 inline-block font-medium text-accent-700 underline hover:text-accent-900">
        Go to the overview
      </Link>
    </div>
  );
}
