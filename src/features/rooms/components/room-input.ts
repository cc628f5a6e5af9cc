import type { RoomInput, RoomView } from '@shared/schemas/rooms';

/** The editable part of a room as the API returned it, for the edit form. */
export function roomInputOfView(r: RoomView): RoomInput {
  return {
    name: r.name,
    town: r.town,
    timeZone: r.timeZone,
    description: r.description,
    dayRateMinor: r.dayRateMinor,
    halfDayRateMinor: r.halfDayRateMinor,
    currency: r.currency,
    inputs: r.inputs,
    dimensions: r.dimensions,
    surfaces: r.surfaces,
    panels: r.panels,
    openings: r.openings,
  };
}
