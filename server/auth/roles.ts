/** Who may do what (README "Security model"). One place for the rule. */
import type { Role } from '../storage';

/** Read stored scenarios, histories, links, readings, exports and the audit list. */
export function canRead(role: Role): boolean {
  return role === 'admin' || role === 'designer' || role === 'viewer';
}

/** Save revisions, restore, make and revoke links, enter readings, issue for construction. */
export function canWrite(role: Role): boolean {
  return role === 'admin' || role === 'designer';
}

/** Manage accounts (the `drydig user` command works on the database directly). */
export function canManageAccounts(role: Role): boolean {
  return role === 'admin';
}
