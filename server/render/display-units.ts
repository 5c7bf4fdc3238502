// The units a sheet asks for in its front matter, by dimension:
//
//   units:
//     Pa: kPa        # pressures in kPa
//     m: mm          # lengths in mm
//
// A key is the SI unit of a dimension as the page shows it ("Pa", "m/s",
// "m^2/s"); a value is any unit of that dimension. A quantity the sheet gave a
// unit itself (`110 km/h`, `x to um`) keeps its own.
import { dimsEqual } from '../units/dims.js';
import { unitLabel } from '../units/labels.js';
import { parseUnit, UnitError, type Unit } from '../units/quantity.js';

export interface DisplayUnits {
  units: Map<string, Unit>;
  /** What could not be read, in words. */
  problems: string[];
}

export function readDisplayUnits(source: string | undefined): DisplayUnits {
  const units = new Map<string, Unit>();
  const problems: string[] = [];
  if (source === undefined) return { units, problems };
  let data: unknown;
  try {
    data = JSON.parse(source);
  } catch {
    data = undefined;
  }
  if (!data || typeof data !== 'object' || Array.isArray(data)) {
    return { units, problems: ['units: in the front matter is a list of `dimension: unit` lines, such as `Pa: kPa`'] };
  }
  for (const [key, value] of Object.entries(data as Record<string, unknown>)) {
    const dimension = unitOrNull(key);
    const wanted = typeof value === 'string' ? unitOrNull(value) : null;
    if (!dimension) problems.push(`units: "${key}" is not a unit; name the dimension by its SI unit, such as Pa, m or m/s`);
    else if (!wanted) problems.push(`units: ${key}: "${String(value)}" is not a unit`);
    else if (!dimsEqual(dimension.dims, wanted.dims)) problems.push(`units: ${key}: ${wanted.text} is not a unit of ${key}`);
    else if (wanted.offset !== 0) problems.push(`units: ${key}: ${wanted.text} has an offset; temperatures keep the unit they were given in`);
    else units.set(unitLabel(dimension.dims), wanted);
  }
  return { units, problems };
}

function unitOrNull(text: string): Unit | null {
  try {
    return parseUnit(text);
  } catch (e) {
    if (e instanceof UnitError) return null;
    throw e;
  }
}
