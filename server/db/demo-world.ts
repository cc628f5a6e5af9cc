// The demo world: an invented scenario. Every person, studio and town here is made up for Kitlane's
// demo; none stands for anyone or anywhere real. All accounts share DEMO_PASSWORD.
import type { SelfChosenRole } from '@shared/permissions';

export type DemoPerson = {
  key: string;
  email: string;
  displayName: string;
  roles: (SelfChosenRole | 'admin')[];
  timeZone: string;
  town: string;
  country: string;
};

export const DEMO_TOWNS = ['Quillmouth', 'Vessary', 'Tarnholm', 'Merrowdown', 'Fennick Cross', 'Lantern Quay'] as const;

export const DEMO_PEOPLE: DemoPerson[] = [
  { key: 'admin', email: 'admin@kitlane.test', displayName: 'Kitlane Desk', roles: ['admin'], timeZone: 'UTC', town: 'Quillmouth', country: 'GB' },
  // Songwriters
  { key: 'mara', email: 'mara@kitlane.test', displayName: 'Mara Quillon', roles: ['songwriter'], timeZone: 'Europe/London', town: 'Quillmouth', country: 'GB' },
  { key: 'teo', email: 'teo@kitlane.test', displayName: 'Teo Vasch', roles: ['songwriter'], timeZone: 'America/New_York', town: 'Vessary', country: 'US' },
  { key: 'ines', email: 'ines@kitlane.test', displayName: 'Ines Maravel', roles: ['songwriter'], timeZone: 'Europe/Berlin', town: 'Tarnholm', country: 'DE' },
  // Drummers
  { key: 'juno', email: 'juno@kitlane.test', displayName: 'Juno Castellane', roles: ['drummer'], timeZone: 'Europe/London', town: 'Merrowdown', country: 'GB' },
  { key: 'odell', email: 'odell@kitlane.test', displayName: 'Odell Brisk', roles: ['drummer'], timeZone: 'America/Chicago', town: 'Fennick Cross', country: 'US' },
  { key: 'sada', email: 'sada@kitlane.test', displayName: 'Sada Imrie', roles: ['drummer'], timeZone: 'Asia/Tokyo', town: 'Lantern Quay', country: 'JP' },
  { key: 'pim', email: 'pim@kitlane.test', displayName: 'Pim Varga', roles: ['drummer'], timeZone: 'Europe/Berlin', town: 'Tarnholm', country: 'DE' },
  { key: 'lux', email: 'lux@kitlane.test', displayName: 'Lux Ferreira-Hale', roles: ['drummer'], timeZone: 'America/Los_Angeles', town: 'Vessary', country: 'US' },
  { key: 'kofi', email: 'kofi@kitlane.test', displayName: 'Kofi Arlen', roles: ['drummer'], timeZone: 'Europe/London', town: 'Quillmouth', country: 'GB' },
  { key: 'wren', email: 'wren@kitlane.test', displayName: 'Wren Solberg', roles: ['drummer', 'engineer'], timeZone: 'Europe/Stockholm', town: 'Merrowdown', country: 'SE' },
  { key: 'tamsin', email: 'tamsin@kitlane.test', displayName: 'Tamsin Oduya', roles: ['drummer'], timeZone: 'Australia/Sydney', town: 'Lantern Quay', country: 'AU' },
  // Engineers
  { key: 'hollis', email: 'hollis@kitlane.test', displayName: 'Hollis Grane', roles: ['engineer'], timeZone: 'Europe/London', town: 'Quillmouth', country: 'GB' },
  { key: 'bea', email: 'bea@kitlane.test', displayName: 'Bea Lindqvist', roles: ['engineer'], timeZone: 'America/New_York', town: 'Vessary', country: 'US' },
  { key: 'rune', email: 'rune@kitlane.test', displayName: 'Rune Halloway', roles: ['engineer'], timeZone: 'Europe/Berlin', town: 'Tarnholm', country: 'DE' },
];
