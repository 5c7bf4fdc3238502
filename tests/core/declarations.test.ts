// The signature of every trade function as the language guide lists it
// (worksheets/guide/language.md, §11): parameter names in order, kinds, dimensions,
// defaults, optional ones and the accepted words. A change here is a change of the
// language, and the guide must change with it.
import { describe, expect, it } from 'vitest';
import { families, type ParamSpec } from '../../server/core/index.js';

const METHODS = '{blasius|schlichting|power|ittc1957|white}';
const PLACEMENT = '{centroid|height}';

const SIGNATURES: Record<string, string[]> = {
  sqrt: ['x:quantity:any'],
  abs: ['x:quantity:any'],
  exp: ['x:quantity:any'],
  ln: ['x:quantity:any'],
  log10: ['x:quantity:any'],
  sin: ['x:quantity:any'],
  cos: ['x:quantity:any'],
  tan: ['x:quantity:any'],
  min: ['values:any'],
  max: ['values:any'],
  linspace: ['start:quantity:any', 'stop:quantity:any', 'count:quantity:1=11'],
  sum: ['values:list:any'],
  mean: ['values:list:any'],
  air: ['T:quantity:K', 'p:quantity:Pa=101325 Pa', 'RH:quantity:1=0 %'],
  atmosphere: ['geopotential:quantity:m?', 'geometric:quantity:m?'],
  water: ['T:quantity:K', 'p:quantity:Pa=101325 Pa'],
  seawater: ['T:quantity:K', 'S:quantity:1=35 g/kg'],
  fluid: ['rho:quantity:kg/m^3', 'mu:quantity:Pa s', 'a:quantity:m/s?'],
  reynolds: ['U:quantity:m/s', 'L:quantity:m', 'fluid:fluid?', 'nu:quantity:m^2/s?'],
  mach: ['U:quantity:m/s', 'fluid:fluid'],
  dynamic_pressure: ['U:quantity:m/s', 'fluid:fluid'],
  flow_regime: ['U:quantity:m/s', 'L:quantity:m', 'fluid:fluid'],
  skin_friction: ['Re_x:quantity:1', `method:string="schlichting"${METHODS}`, 'kind:string="local"{local|mean}'],
  boundary_layer: ['U:quantity:m/s', 'x:quantity:m', 'fluid:fluid'],
  first_cell: ['U:quantity:m/s', 'L:quantity:m', 'fluid:fluid', 'yplus:quantity:1=1', `method:string="schlichting"${METHODS}`, `placement:string="centroid"${PLACEMENT}`],
  yplus: ['height:quantity:m', 'U:quantity:m/s', 'L:quantity:m', 'fluid:fluid', `placement:string="centroid"${PLACEMENT}`, `method:string="schlichting"${METHODS}`],
  law_of_wall: ['yplus:quantity:1'],
  friction_velocity: ['U_p:quantity:m/s', 'y_p:quantity:m', 'fluid:fluid'],
  layer_stack: ['first:quantity:m?', 'growth:quantity:1?', 'count:quantity:1?', 'total:quantity:m?', 'core:quantity:m?', 'delta:quantity:m?', 'scale:string="linear"{linear|log}'],
  yplus_report: ['path:string', 'column:string="yplus"', 'weight:string="area"', 'target:quantity:1=1', 'band:list:1=[0.5, 5]', 'first:quantity:m?'],
};

function signature(p: ParamSpec): string {
  return `${p.name}:${p.type}${p.unit ? `:${p.unit}` : ''}${p.default !== undefined ? `=${p.default}` : ''}${p.optional ? '?' : ''}${p.choices ? `{${p.choices.join('|')}}` : ''}`;
}

describe('trade-function signatures', () => {
  const all = families.flat();
  it('lists the functions of the guide, each once', () => {
    expect(all.map((f) => f.name)).toEqual(Object.keys(SIGNATURES));
  });
  for (const f of all) {
    it(f.name, () => expect(f.params.map(signature)).toEqual(SIGNATURES[f.name]));
  }
});
