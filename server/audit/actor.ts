import type { Role } from '@shared/auth/roles';

/** Where a change came from, for the audit trail: the client's address and user agent (both null when no request asked for it). */
export interface RequestOrigin {
  ip: string | null;
  userAgent: string | null;
}

/** Who is acting, for whom, from where: what services need to scope, check and audit a change. */
export interface Actor {
  operatorId: number;
  userId: number;
  role: Role;
  /** The address and user agent the audit trail records (none for the demo seed). */
  origin?: RequestOrigin;
  /**
   * Whether the change announces itself by mail once it commits: true for changes people make
   * through the API; the demo seed runs the same services and sends nothing (absent: false).
   */
  sendsMail?: boolean;
}
