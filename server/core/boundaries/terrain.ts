// Terrain categories of EN 1991-1-4:2005, Table 4.1 (roughness length z0 and
// minimum height z_min; z_max = 200 m, §4.3.2), and the terrain factor
// k_r = 0.19 (z0/z0,II)^0.07 of Eq. 4.5 with z0,II = 0.05 m.
import { TradeError } from '../shared/trade-error.js';
import { quotedList } from '../shared/words.js';

export const TERRAIN_CATEGORIES = ['0', 'I', 'II', 'III', 'IV'] as const;
export type TerrainCategory = (typeof TERRAIN_CATEGORIES)[number];

export interface Terrain {
  category: TerrainCategory;
  description: string;
  z0: number;
  z_min: number;
  z_max: number;
  k_r: number;
}

export const Z_MAX = 200;
const Z0_II = 0.05;

const TABLE: Record<TerrainCategory, { description: string; z0: number; z_min: number }> = {
  '0': { description: 'sea or coastal area exposed to the open sea', z0: 0.003, z_min: 1 },
  I: { description: 'lakes, or flat and horizontal area with negligible vegetation and without obstacles', z0: 0.01, z_min: 1 },
  II: { description: 'area with low vegetation such as grass and isolated obstacles (trees, buildings) at least 20 obstacle heights apart', z0: 0.05, z_min: 2 },
  III: { description: 'area with regular cover of vegetation or buildings, or isolated obstacles at most 20 obstacle heights apart (villages, suburban terrain, permanent forest)', z0: 0.3, z_min: 5 },
  IV: { description: 'area in which at least 15 % of the surface is covered with buildings whose average height exceeds 15 m', z0: 1.0, z_min: 10 },
};

export function terrainCategory(category: string): Terrain {
  if (!(TERRAIN_CATEGORIES as readonly string[]).includes(category)) {
    throw new TradeError(`"${category}" is not a terrain category of EN 1991-1-4; the categories are ${quotedList(TERRAIN_CATEGORIES)}`);
  }
  const c = category as TerrainCategory;
  const row = TABLE[c];
  return { category: c, ...row, z_max: Z_MAX, k_r: 0.19 * (row.z0 / Z0_II) ** 0.07 };
}
