import { paths } from '@/config/paths';

export type NavItem = { label: string; href: string };

type RoleNav = { role: string; items: NavItem[] };

// Each side of the marketplace sees where its own work is. A person with several roles gets the union,
// in this order, with shared destinations (e.g. "My profile" for a drummer who is also an engineer) once.
const BY_ROLE: RoleNav[] = [
  { role: 'songwriter', items: [{ label: 'My briefs', href: paths.myBriefs.getHref() }, { label: 'Find drummers', href: paths.findDrummers.getHref() }] },
  {
    role: 'drummer',
    items: [
      { label: 'Open briefs', href: paths.openBriefs.getHref() },
      { label: 'My profile', href: paths.myProfile.getHref() },
      { label: 'My quotes', href: paths.myQuotes.getHref() },
    ],
  },
  { role: 'engineer', items: [{ label: 'My rooms', href: paths.myRooms.getHref() }, { label: 'My profile', href: paths.myProfile.getHref() }] },
  { role: 'admin', items: [{ label: 'Admin desk', href: paths.adminDesk.getHref() }] },
];

const SIGNED_IN_COMMON: NavItem[] = [
  { label: 'Messages', href: paths.messages.getHref() },
  { label: 'Bookings', href: paths.bookings.getHref() },
];

const SIGNED_OUT: NavItem[] = [
  { label: 'Find drummers', href: paths.findDrummers.getHref() },
  { label: 'Rooms', href: paths.rooms.getHref() },
];

function uniqueByHref(items: NavItem[]): NavItem[] {
  const seen = new Set<string>();
  return items.filter((item) => (seen.has(item.href) ? false : (seen.add(item.href), true)));
}

/** The main navigation links for someone with these roles; `null` means signed out. */
export function navigationFor(roles: readonly string[] | null): NavItem[] {
  if (roles === null) return SIGNED_OUT;
  const own = BY_ROLE.filter((entry) => roles.includes(entry.role)).flatMap((entry) => entry.items);
  return uniqueByHref([...own, ...SIGNED_IN_COMMON]);
}
