import { NavLink } from 'react-router-dom';
import { paths } from '@/config/paths';
import { cx } from '@/components/ui';

const LINKS = [
  { to: paths.adminDesk.getHref(), label: 'Disputes', end: true },
  { to: paths.adminBookings.getHref(), label: 'Bookings', end: false },
  { to: paths.adminAccounts.getHref(), label: 'Accounts', end: false },
  { to: paths.adminLedger.getHref(), label: 'Ledger', end: false },
  { to: paths.adminAudit.getHref(), label: 'Audit log', end: false },
];

/** The desk's own sections, above every admin page. */
export function AdminNav() {
  return (
    <nav aria-label="Admin desk" className="mb-6 flex flex-wrap gap-2 border-b border-line pb-3">
      {LINKS.map((link) => (
        <NavLink
          key={link.to}
          to={link.to}
          end={link.end}
          className={({ isActive }) => cx('rounded-lg px-3 py-1.5 font-medium', isActive ? 'bg-brand-100 text-brand-900' : 'text-ink hover:bg-canvas-sunken')}
        >
          {link.label}
        </NavLink>
      ))}
    </nav>
  );
}
