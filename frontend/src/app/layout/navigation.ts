import type { Role } from '@veracast/shared-types';
import { paths } from '../../lib/paths';

export interface NavItem {
  label: string;
  href: string;
  /** The least powerful role that sees the entry; everyone signed in when absent. */
  minimum?: Role;
  /** Match only the exact path (for the overview at `/`). */
  end?: boolean;
}

export interface NavGroup {
  label: string;
  items: NavItem[];
  minimum?: Role;
}

export const NAVIGATION: NavGroup[] = [
  {
    label: 'Audit work',
    items: [
      { label: 'Overview', href: paths.home.href(), end: true },
      { label: 'Elections', href: paths.elections.href() },
      { label: 'Pollsters', href: paths.pollsters.href() },
      { label: 'Audits', href: paths.audits.href() },
      { label: 'Shared error', href: paths.sharedError.href() },
      { label: 'Imports', href: paths.imports.href(), minimum: 'analyst' },
      { label: 'Notes', href: paths.notes.href() },
      { label: 'Data quality', href: paths.dataQuality.href() },
      { label: 'Methods', href: paths.methods.href() },
    ],
  },
  {
    label: 'Settings',
    items: [{ label: 'API tokens', href: paths.apiTokens.href() }],
  },
  {
    label: 'Admin',
    minimum: 'admin',
    items: [
      { label: 'Users & invitations', href: paths.adminUsers.href() },
      { label: 'Local mailbox', href: paths.adminMailbox.href() },
    ],
  },
];
