/**
 * How a stored revision is described to the site team and in the report: "issued for construction"
 * only when someone recorded it so (who and when, from the audit trail), else "saved". A link that
 * pins a revision shows that one revision; that alone is no approval.
 */

/** Who recorded a revision as issued for construction, and when (ISO 8601). */
export interface RevisionIssueRecord {
  by: string;
  at: string;
}

/** Options for `describeRevisionStatus`. */
export interface RevisionStatusOptions {
  revision: number;
  issued: RevisionIssueRecord | null;
  /** True when the link or request pins this revision (else it is the latest). */
  pinned?: boolean;
  /** Formats a time for the reader. Default: the ISO text as stored. */
  formatTime?: (iso: string) => string;
}

/** Short badge: "revision 2 · issued for construction" or "revision 2 · saved, latest". */
export function revisionBadge(o: RevisionStatusOptions): string {
  const state = o.issued ? 'issued for construction' : 'saved';
  return `revision ${o.revision} · ${state}${o.pinned === undefined ? '' : o.pinned ? ', this revision only' : ', latest'}`;
}

/** One sentence on the revision's status. */
export function describeRevisionStatus(o: RevisionStatusOptions): string {
  const time = o.formatTime ?? ((iso: string) => iso);
  if (o.issued) return `Revision ${o.revision} was issued for construction by ${o.issued.by} on ${time(o.issued.at)}.`;
  return `Revision ${o.revision} is saved; nobody has recorded it as issued for construction.`;
}
