import { describe, expect, it } from 'vitest';
import { navigationFor } from './navigation';

const labels = (roles: string[] | null) => navigationFor(roles).map((item) => item.label);

describe('navigationFor', () => {
  it('offers public searches to signed-out visitors', () => {
    expect(labels(null)).toEqual(['Find drummers', 'Rooms']);
  });

  it('gives a songwriter their briefs and the drummer search, then messages and bookings', () => {
    expect(labels(['songwriter'])).toEqual(['My briefs', 'Find drummers', 'Messages', 'Bookings']);
  });

  it('lists "My profile" once for a drummer who is also an engineer', () => {
    expect(labels(['drummer', 'engineer'])).toEqual(['Open briefs', 'My profile', 'My quotes', 'My rooms', 'Messages', 'Bookings']);
  });

  it('keeps the role order fixed whatever order the roles arrive in', () => {
    expect(labels(['engineer', 'songwriter'])).toEqual(['My briefs', 'Find drummers', 'My rooms', 'My profile', 'Messages', 'Bookings']);
  });

  it('shows the admin desk only to admins', () => {
    expect(labels(['admin'])).toEqual(['Admin desk', 'Messages', 'Bookings']);
    expect(labels(['songwriter', 'drummer', 'engineer'])).not.toContain('Admin desk');
  });

  it('ignores roles it does not know', () => {
    expect(labels(['producer'])).toEqual(['Messages', 'Bookings']);
  });
});
