// Demo rooms and mic packages for the demo engineers, made through the same services users go through.
// Sizes and treatments differ on purpose so search and the acoustics plots have something to show:
// a big brick live room, a small treated room, a very live stone hall, a controlled booth and a wooden barn.
// Every name and town is invented (server/db/demo-world.ts).
import { eq } from 'drizzle-orm';
import type { AppContext } from '../../app';
import type { CurrentUser } from '../../auth/middleware';
import { users } from '../../db/schema';
import type { SeedStep } from '../../db/seed-steps';
import { channelsFromTemplate, type TemplateId } from '@shared/mic-package';
import { todayIn } from '@shared/schemas/briefs';
import { micPackageInputSchema, type MicChannelInput } from '@shared/schemas/mic-packages';
import { roomInputSchema, type RoomInput } from '@shared/schemas/rooms';
import { createMicPackagesService } from '../mic-packages/mic-packages.service';
import { createRoomsService } from './rooms.service';

type Finish = RoomInput['surfaces']['floor'];
const material = (materialId: Extract<Finish, { kind: 'material' }>['materialId']): Finish => ({ kind: 'material', materialId });
const walls = (finish: Finish) => ({ frontWall: finish, backWall: finish, leftWall: finish, rightWall: finish });
const fibre = material('glass_fibre_board_50mm');

type DemoPackage = { name: string; priceMinor: number; template: TemplateId; edit?: (channels: MicChannelInput[]) => MicChannelInput[] };
type DemoRoom = { owner: string; room: RoomInput; blockedInDays: number[]; packages: DemoPackage[] };

/** Names the engineer's own microphones by type only; Kitlane never names real products. */
function withModels(channels: MicChannelInput[], models: Partial<Record<MicChannelInput['source'], string>>): MicChannelInput[] {
  return channels.map((c) => ({ ...c, model: models[c.source] ?? c.model }));
}

const DEMO_ROOMS: DemoRoom[] = [
  {
    owner: 'hollis',
    room: {
      name: 'Quillmouth Brick Room',
      town: 'Quillmouth',
      timeZone: 'Europe/London',
      description: 'A tall live room with bare brick walls and an old wooden floor. Absorbers behind the kit and over it keep the ring in check without killing it.',
      dayRateMinor: 45_000,
      halfDayRateMinor: 26_000,
      currency: 'GBP',
      inputs: 32,
      dimensions: { unit: 'm', length: 9, width: 7, height: 4.2 },
      surfaces: { floor: material('wood_floor'), ceiling: material('plywood_panel_10mm'), ...walls(material('unglazed_brick')) },
      panels: [
        { surface: 'backWall', areaM2: 8, finish: fibre },
        { surface: 'ceiling', areaM2: 10, finish: fibre },
        { surface: 'leftWall', areaM2: 4, finish: fibre },
      ],
      openings: [{ type: 'door', surface: 'frontWall', areaM2: 2, finish: { kind: 'custom', coefficients: [0.14, 0.1, 0.06, 0.08, 0.1, 0.1], label: 'Solid wooden door' } }],
    },
    blockedInDays: [3, 4, 10, 11, 24],
    packages: [
      { name: 'Big room, 12 channels', priceMinor: 18_000, template: 'twelve_channel', edit: (ch) => withModels(ch, { kick_in: 'Large dynamic from the mic locker', room_l: 'Matched pair A', room_r: 'Matched pair B' }) },
      { name: 'Four-mic classic', priceMinor: 7_000, template: 'four_channel' },
    ],
  },
  {
    owner: 'bea',
    room: {
      name: 'Vessary Dead Room',
      town: 'Vessary',
      timeZone: 'America/New_York',
      description: 'A small, heavily treated room for tight, dry drums. Thick carpet, absorbers on every wall and a cloud over the kit.',
      dayRateMinor: 30_000,
      halfDayRateMinor: 17_000,
      currency: 'USD',
      inputs: 16,
      dimensions: { unit: 'ft', length: 15, width: 12.5, height: 9 },
      surfaces: { floor: material('heavy_carpet_on_foam_underlay'), ceiling: material('gypsum_board_on_studs'), ...walls(material('gypsum_board_on_studs')) },
      panels: [
        { surface: 'leftWall', areaM2: 4, finish: fibre },
        { surface: 'rightWall', areaM2: 4, finish: fibre },
        { surface: 'frontWall', areaM2: 3, finish: fibre },
        { surface: 'backWall', areaM2: 3, finish: fibre },
        { surface: 'ceiling', areaM2: 5, finish: fibre },
      ],
      openings: [],
    },
    blockedInDays: [1, 2, 15],
    packages: [{ name: 'Tight eight', priceMinor: 9_000, template: 'eight_channel' }],
  },
  {
    owner: 'rune',
    room: {
      name: 'Tarnholm Stone Hall',
      town: 'Tarnholm',
      timeZone: 'Europe/Berlin',
      description: 'A former storage hall with plastered stone walls under a wooden roof: a huge, long ring for big, simple parts.',
      dayRateMinor: 80_000,
      halfDayRateMinor: 45_000,
      currency: 'EUR',
      inputs: 48,
      dimensions: { unit: 'm', length: 14, width: 10, height: 7 },
      surfaces: { floor: material('wood_floor'), ceiling: material('plywood_panel_10mm'), ...walls(material('plaster_on_masonry')) },
      panels: [{ surface: 'backWall', areaM2: 20, finish: material('heavy_curtain_draped') }],
      openings: [{ type: 'window', surface: 'leftWall', areaM2: 6, finish: material('window_glass') }],
    },
    blockedInDays: [7, 8, 9],
    packages: [{ name: 'Hall, 12 channels', priceMinor: 15_000, template: 'twelve_channel' }],
  },
  {
    owner: 'rune',
    room: {
      name: 'Tarnholm Booth B',
      town: 'Tarnholm',
      timeZone: 'Europe/Berlin',
      description: 'A mid-sized tracking room with block walls and broadband panels: controlled, with some air around the kit.',
      dayRateMinor: 38_000,
      halfDayRateMinor: 21_000,
      currency: 'EUR',
      inputs: 24,
      dimensions: { unit: 'm', length: 6, width: 5, height: 3 },
      surfaces: { floor: material('wood_floor'), ceiling: material('gypsum_board_on_studs'), ...walls(material('painted_block_wall')) },
      panels: [
        { surface: 'leftWall', areaM2: 4, finish: fibre },
        { surface: 'rightWall', areaM2: 4, finish: fibre },
        { surface: 'ceiling', areaM2: 4, finish: fibre },
      ],
      openings: [{ type: 'door', surface: 'backWall', areaM2: 1.8, finish: { kind: 'custom', coefficients: [0.14, 0.1, 0.06, 0.08, 0.1, 0.1], label: 'Wooden door' } }],
    },
    blockedInDays: [],
    packages: [{ name: 'Booth eight', priceMinor: 8_000, template: 'eight_channel' }],
  },
  {
    owner: 'wren',
    room: {
      name: 'Merrowdown Barn',
      town: 'Merrowdown',
      timeZone: 'Europe/Stockholm',
      description: 'A converted barn with plywood walls and a wooden floor: lively and warm. The drummer is also the engineer here.',
      dayRateMinor: 350_000,
      halfDayRateMinor: 200_000,
      currency: 'SEK',
      inputs: 12,
      dimensions: { unit: 'm', length: 8, width: 6, height: 3.5 },
      surfaces: { floor: material('wood_floor'), ceiling: material('plywood_panel_10mm'), ...walls(material('plywood_panel_10mm')) },
      // A big rug under the kit.
      panels: [{ surface: 'floor', areaM2: 12, finish: material('heavy_carpet_on_concrete') }],
      openings: [{ type: 'door', surface: 'frontWall', areaM2: 4, finish: { kind: 'open' } }],
    },
    blockedInDays: [5, 6],
    packages: [
      {
        name: 'Barn kit, 12 in',
        priceMinor: 120_000,
        template: 'twelve_channel',
        // A mono room mic instead of the right room mic: the barn is narrow.
        edit: (ch) => ch.map((c) => (c.source === 'room_r' ? { ...c, source: 'room_mono', micType: 'ribbon', pattern: 'figure_eight', distanceCm: 200, aim: 'At the kit from the front, at chest height' } : c)),
      },
    ],
  },
];

function demoUser(ctx: AppContext, id: string): CurrentUser {
  const row = ctx.db.select().from(users).where(eq(users.id, id)).get();
  if (!row) throw new Error(`demo user ${id} is missing`);
  return { id: row.id, email: row.email, displayName: row.displayName, roles: row.roles, emailVerified: row.emailVerifiedAt != null, timeZone: row.timeZone };
}

function addDays(date: string, days: number): string {
  const [y, m, d] = date.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
}

export const roomsSeedStep: SeedStep = {
  name: 'rooms and mic packages',
  run(ctx, state) {
    const rooms = createRoomsService(ctx);
    const packages = createMicPackagesService(ctx);
    const roomIds: Record<string, string[]> = {};
    const micPackageIds: Record<string, string[]> = {};
    for (const demo of DEMO_ROOMS) {
      const owner = demoUser(ctx, state.userIds[demo.owner]);
      const room = rooms.create(owner, roomInputSchema.parse(demo.room));
      const today = todayIn(room.timeZone);
      rooms.setBlockedDates(owner, room.id, { dates: demo.blockedInDays.map((d) => addDays(today, d)) });
      (roomIds[demo.owner] ??= []).push(room.id);
      for (const p of demo.packages) {
        const base = channelsFromTemplate(p.template).map((c) => ({ ...c, distanceCm: c.distanceCm ?? null, aim: c.aim ?? '', model: c.model ?? '', note: c.note ?? '' }));
        const channels = p.edit ? p.edit(base) : base;
        const pkg = packages.create(owner, room.id, micPackageInputSchema.parse({ name: p.name, priceMinor: p.priceMinor, currency: room.currency, channels }));
        (micPackageIds[demo.owner] ??= []).push(pkg.id);
      }
    }
    // Later steps may name these in quotes (e.g. a quote on a EUR brief naming one of rune's packages).
    state.roomIds = roomIds;
    state.micPackageIds = micPackageIds;
  },
};
