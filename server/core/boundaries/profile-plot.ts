// The inflow profile as a line chart: wind speed across, height up, with the
// reference height and (from a terrain record) EN 1991-1-4's z_min marked.
import { linePlot, type ReferenceLine } from '../shared/plot.js';
import type { AblProfile } from './abl-profile.js';

const CURVE_POINTS = 60;

export interface ProfilePlotInput {
  profile: AblProfile;
  heights: readonly number[];
  z_ref: number;
  z_min?: number;
}

export function profileSvg(p: ProfilePlotInput): string {
  const top = Math.max(p.z_ref, ...p.heights) * 1.05;
  // Points crowd towards the ground, where the logarithm bends most.
  const curve = Array.from({ length: CURVE_POINTS + 1 }, (_, i) => {
    const z = top * (i / CURVE_POINTS) ** 2;
    return [p.profile.at(z).U, z] as const;
  });
  const references: ReferenceLine[] = [{ axis: 'y', at: p.z_ref, label: 'z_ref' }];
  if (p.z_min !== undefined) references.push({ axis: 'y', at: p.z_min, label: 'z_min (EN 1991-1-4)', colour: '#c0392b' });
  return linePlot({
    title: 'Inflow profile U(z), Richards & Hoxey (1993)',
    x: { label: 'U (m/s)', min: 0 },
    y: { label: 'z (m)', min: 0 },
    series: [
      { name: 'U(z)', points: curve },
      { name: 'table heights', points: p.heights.map((z) => [p.profile.at(z).U, z] as const), dots: true, line: false },
    ],
    references,
  });
}
