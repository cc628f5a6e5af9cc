// Absorption coefficients per octave band for the surfaces an engineer can pick.
//
// Source of the first seven rows: "typical handbook values, from memory" as listed in
// /work/shared/REFERENCES.md (Acoustics and safety). The other rows are the values that appear in the
// widely reprinted general-purpose absorption tables of architectural-acoustics handbooks; they were
// written down from memory and not re-verified against a printed table, so each says so in `source`.
// A coefficient is the fraction of incident sound energy a surface absorbs (0 = reflects all, 1 = absorbs all).

export const OCTAVE_BANDS_HZ = [125, 250, 500, 1000, 2000, 4000] as const;
export type OctaveBandHz = (typeof OCTAVE_BANDS_HZ)[number];

/** One coefficient per octave band, in the order of OCTAVE_BANDS_HZ. */
export type BandCoefficients = readonly [number, number, number, number, number, number];

export const MATERIAL_IDS = [
  'concrete_floor',
  'painted_block_wall',
  'gypsum_board_on_studs',
  'wood_floor',
  'heavy_carpet_on_concrete',
  'window_glass',
  'glass_fibre_board_50mm',
  'unglazed_brick',
  'unpainted_concrete_block',
  'plaster_on_masonry',
  'plywood_panel_10mm',
  'vinyl_tile_on_concrete',
  'heavy_carpet_on_foam_underlay',
  'heavy_curtain_draped',
  'glazed_tile_or_marble',
] as const;
export type MaterialId = (typeof MATERIAL_IDS)[number];

export interface Material {
  id: MaterialId;
  label: string;
  bands: BandCoefficients;
  /** Where the numbers come from, shown beside the table in the UI. */
  source: string;
}

const HANDBOOK_FROM_REFERENCES = 'typical handbook values, from memory (REFERENCES.md, Acoustics and safety)';
const HANDBOOK_FROM_MEMORY = 'general handbook absorption table, from memory (not re-verified)';

const MATERIAL_LIST: readonly Material[] = [
  { id: 'concrete_floor', label: 'Concrete floor', bands: [0.01, 0.01, 0.015, 0.02, 0.02, 0.02], source: HANDBOOK_FROM_REFERENCES },
  { id: 'painted_block_wall', label: 'Painted concrete block wall', bands: [0.1, 0.05, 0.06, 0.07, 0.09, 0.08], source: HANDBOOK_FROM_REFERENCES },
  { id: 'gypsum_board_on_studs', label: 'Gypsum board on studs', bands: [0.29, 0.1, 0.05, 0.04, 0.07, 0.09], source: HANDBOOK_FROM_REFERENCES },
  { id: 'wood_floor', label: 'Wood floor', bands: [0.15, 0.11, 0.1, 0.07, 0.06, 0.07], source: HANDBOOK_FROM_REFERENCES },
  { id: 'heavy_carpet_on_concrete', label: 'Heavy carpet on concrete', bands: [0.02, 0.06, 0.14, 0.37, 0.6, 0.65], source: HANDBOOK_FROM_REFERENCES },
  { id: 'window_glass', label: 'Window glass', bands: [0.35, 0.25, 0.18, 0.12, 0.07, 0.04], source: HANDBOOK_FROM_REFERENCES },
  // Handbook tables print this board at or slightly above 1.00 in the mid bands (an artefact of the
  // reverberation-chamber method); the table keeps 1.00, the largest value a coefficient may have here.
  { id: 'glass_fibre_board_50mm', label: 'Glass-fibre board, 50 mm', bands: [0.17, 0.86, 1, 1, 1, 1], source: HANDBOOK_FROM_REFERENCES },
  { id: 'unglazed_brick', label: 'Brick, unglazed', bands: [0.03, 0.03, 0.03, 0.04, 0.05, 0.07], source: HANDBOOK_FROM_MEMORY },
  { id: 'unpainted_concrete_block', label: 'Concrete block, coarse, unpainted', bands: [0.36, 0.44, 0.31, 0.29, 0.39, 0.25], source: HANDBOOK_FROM_MEMORY },
  { id: 'plaster_on_masonry', label: 'Smooth plaster on brick or block', bands: [0.013, 0.015, 0.02, 0.03, 0.04, 0.05], source: HANDBOOK_FROM_MEMORY },
  { id: 'plywood_panel_10mm', label: 'Plywood panelling, 10 mm', bands: [0.28, 0.22, 0.17, 0.09, 0.1, 0.11], source: HANDBOOK_FROM_MEMORY },
  { id: 'vinyl_tile_on_concrete', label: 'Vinyl or linoleum tile on concrete', bands: [0.02, 0.03, 0.03, 0.03, 0.03, 0.02], source: HANDBOOK_FROM_MEMORY },
  { id: 'heavy_carpet_on_foam_underlay', label: 'Heavy carpet on foam underlay', bands: [0.08, 0.24, 0.57, 0.69, 0.71, 0.73], source: HANDBOOK_FROM_MEMORY },
  { id: 'heavy_curtain_draped', label: 'Heavy velour curtain, draped to half its area', bands: [0.14, 0.35, 0.55, 0.72, 0.7, 0.65], source: HANDBOOK_FROM_MEMORY },
  { id: 'glazed_tile_or_marble', label: 'Glazed tile or marble', bands: [0.01, 0.01, 0.01, 0.01, 0.02, 0.02], source: HANDBOOK_FROM_MEMORY },
];

export const MATERIALS: Readonly<Record<MaterialId, Material>> = Object.freeze(
  Object.fromEntries(MATERIAL_LIST.map((m) => [m.id, m])) as Record<MaterialId, Material>,
);

/** All materials in display order (the order of MATERIAL_IDS). */
export function listMaterials(): readonly Material[] {
  return MATERIAL_LIST;
}

export function isMaterialId(value: string): value is MaterialId {
  return (MATERIAL_IDS as readonly string[]).includes(value);
}

export function getMaterial(id: MaterialId): Material {
  return MATERIALS[id];
}

/** True when every value is a finite number in 0–1 and there is one per octave band. */
export function isValidCoefficients(values: readonly number[]): values is BandCoefficients {
  return values.length === OCTAVE_BANDS_HZ.length && values.every((v) => Number.isFinite(v) && v >= 0 && v <= 1);
}
