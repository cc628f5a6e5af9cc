// The admin desk (issue 4): accounts (disable, enable, grant admin) and bookings search. The ledger views
// are the payments feature's (/api/admin/ledger, /api/bookings/:id/ledger). Every action that changes something writes its audit row in the same transaction.
import type { Db } from '../../db/client';
import type { AuthLucia } from '../../auth/lucia';
import type { CurrentUser } from '../../auth/middleware';
import { assertCan } from '../../auth/middleware';
import { AppError, conflict, notFound } from '../../http/app-error';
import { recordAudit } from '../audit/audit.service';
import { createDisputesRepository } from '../disputes/disputes.repository';
import type {
  AccountActionInput,
  AdminAccountList,
  AdminAccountView,
  AdminAccountsQuery,
  AdminBookingList,
  AdminBookingsQuery,
} from '@shared/schemas/admin';
import { createAdminRepository, type UserRow } from './admin.repository';

function accountView(row: UserRow, bookings: number): AdminAccountView {
  return {
    id: row.id,
    email: row.email,
    displayName: row.displayName,
    roles: row.roles,
    emailVerified: row.emailVerifiedAt !== null,
    disabledAt: row.disabledAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
    bookings,
  };
}

export function createAdminService(deps: { db: Db; lucia: AuthLucia }) {
  const { db, lucia } = deps;
  const repo = createAdminRepository(db);
  const disputes = createDisputesRepository(db);

  /** The account as the list shows it, read again after a change. */
  function fresh(userId: string): AdminAccountView {
    const row = repo.accounts(userId, 1, 0).rows.find((r) => r.user.id === userId)!;
    return accountView(row.user, Number(row.bookings));
  }

  function targetAccount(admin: CurrentUser, userId: string): UserRow {
    const row = repo.findUser(userId);
    if (!row) throw notFound('That account');
    if (row.id === admin.id) throw new AppError('own_account', 'Admins cannot change their own account from the desk; ask another admin', 400);
    return row;
  }

  return {
    accounts(admin: CurrentUser, query: AdminAccountsQuery): AdminAccountList {
      assertCan(admin, 'disable:account:any');
      const { rows, total } = repo.accounts(query.q, query.limit, query.offset);
      return { items: rows.map((r) => accountView(r.user, Number(r.bookings))), total };
    },

    /** A disabled person cannot sign in, and every session they have ends now. */
    async disable(admin: CurrentUser, userId: string, input: AccountActionInput): Promise<AdminAccountView> {
      assertCan(admin, 'disable:account:any');
      const row = targetAccount(admin, userId);
      if (row.disabledAt) throw conflict('already_disabled', 'This account is already disabled');
      db.transaction((tx) => {
        repo.setDisabled(userId, new Date(), tx);
        recordAudit(tx, { actorId: admin.id, action: 'disable', targetType: 'user', targetId: userId, note: input.reason });
      });
      // After the commit: a session check racing with this already sees disabledAt and refuses (auth middleware).
      await lucia.invalidateUserSessions(userId);
      return fresh(userId);
    },

    enable(admin: CurrentUser, userId: string, input: AccountActionInput): AdminAccountView {
      assertCan(admin, 'disable:account:any');
      const row = targetAccount(admin, userId);
      if (!row.disabledAt) throw conflict('not_disabled', 'This account is not disabled');
      db.transaction((tx) => {
        repo.setDisabled(userId, null, tx);
        recordAudit(tx, { actorId: admin.id, action: 'enable', targetType: 'user', targetId: userId, note: input.reason });
      });
      return fresh(userId);
    },

    grantAdmin(admin: CurrentUser, userId: string, input: AccountActionInput): AdminAccountView {
      assertCan(admin, 'grant:admin:any');
      const row = targetAccount(admin, userId);
      if (row.roles.includes('admin')) throw conflict('already_admin', 'This account is already an admin');
      if (row.disabledAt) throw conflict('account_disabled', 'Enable the account before making it an admin');
      db.transaction((tx) => {
        repo.setRoles(userId, [...row.roles, 'admin'], tx);
        recordAudit(tx, { actorId: admin.id, action: 'grant', targetType: 'user', targetId: userId, note: input.reason });
      });
      return fresh(userId);
    },

    bookings(admin: CurrentUser, query: AdminBookingsQuery): AdminBookingList {
      assertCan(admin, 'read:booking:any');
      const { rows, total } = repo.bookings(query.q, query.status, query.limit, query.offset);
      const open = disputes.openIdsByBooking(rows.map((r) => r.booking.id));
      return {
        items: rows.map((r) => ({
          id: r.booking.id,
          songTitle: r.booking.terms.songTitle,
          status: r.booking.status,
          totalMinor: r.booking.totalMinor,
          currency: r.booking.currency,
          songwriter: r.songwriter,
          drummer: r.drummer,
          engineer: r.engineer,
          openDisputeId: open.get(r.booking.id) ?? null,
          createdAt: r.booking.createdAt.toISOString(),
          updatedAt: r.booking.updatedAt.toISOString(),
        })),
        total: Number(total),
      };
    },

  };
}
export type AdminService = ReturnType<typeof createAdminService>;
