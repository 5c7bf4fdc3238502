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
  domain: ['body:list:m', 'rule:string="three-lengths"{three-lengths|cost732|aij}', 'upstream:quantity:m?', 'downstream:quantity:m?', 'lateral:quantity:m?', 'top:quantity:m?', 'ground:bool=true', 'frontal:quantity:m^2?'],
  domain_study: ['small:quantity:any', 'large:quantity:any', 'tol:quantity:1=1 %'],
  refinement: ['base:quantity:m', 'target:quantity:m'],
  zone: ['box:list:m?', 'level:quantity:1', 'shell:quantity:m?', 'area:quantity:m^2?', 'body:list:m?', 'ground:bool=true', 'volume:quantity:m^3?', 'solid:quantity:m^3?', 'label:string?'],
  cell_budget: ['domain:any', 'base:quantity:m', 'zones:list?', 'surface:record?', 'layers:record?', 'solid:quantity:m^3?', 'volumes:string="nested"{nested|exclusive}', 'tet_per_hex:quantity:1=5.5', 'tet_per_poly:quantity:1=4.5', 'memory_per_million:quantity:1=2', 'cpu_per_million:quantity:s=2 h', 'iterations:quantity:1=1000'],
  inlet_turbulence: ['U:quantity:m/s', 'intensity:quantity:1', 'length:quantity:m?', 'fluid:fluid', 'viscosity_ratio:quantity:1?', 'C_mu:quantity:1=0.09'],
  duct_length_scale: ['D_h:quantity:m'],
  terrain: ['category:string{0|I|II|III|IV}'],
  abl: ['U_ref:quantity:m/s', 'z_ref:quantity:m', 'z0:any', 'heights:list:m', 'kappa:quantity:1=0.41', 'C_mu:quantity:1=0.09'],
  wall: ['patch:string', 'roughness:quantity:m?'],
  moving_wall: ['patch:string', 'U:list:m/s'],
  rotating_wall: ['patch:string', 'omega:quantity:1/s?', 'axis:list:1=[0, -1, 0]', 'origin:list:m=[0, 0, 0] m', 'radius:quantity:m?', 'rim:quantity:m/s?'],
  slip: ['patch:string'],
  symmetry: ['patch:string'],
  velocity_inlet: ['patch:string', 'U:list:m/s?', 'turbulence:record?', 'distance:quantity:m?'],
  pressure_inlet: ['patch:string', 'p0:quantity:Pa=0 Pa', 'direction:list:1=[1, 0, 0]', 'turbulence:record?', 'distance:quantity:m?'],
  pressure_outlet: ['patch:string', 'p:quantity:Pa=0 Pa', 'distance:quantity:m?'],
  flow_rate_outlet: ['patch:string', 'Q:quantity:m^3/s', 'distance:quantity:m?'],
  opening: ['patch:string', 'p:quantity:Pa=0 Pa', 'turbulence:record?', 'distance:quantity:m?'],
  boundaries: ['patches:list', 'domain:record?', 'compressible:bool=false'],
  time_step: ['U:quantity:m/s', 'dx:quantity:m', 'courant:quantity:1=1'],
  flow_through: ['length:quantity:m', 'U:quantity:m/s'],
  shedding: ['U:quantity:m/s', 'D:quantity:m', 'St:quantity:1=0.2', 'dt:quantity:s?'],
  force_coefficients: ['F:list:N', 'fluid:fluid', 'U:quantity:m/s', 'A:quantity:m^2', 'M:quantity:N m?', 'l_ref:quantity:m?'],
  residuals: ['path:string', 'target_drop:quantity:1=4', 'window:quantity:1=200', 'initial:quantity:1=5'],
  monitor: ['path:string', 'column:string?', 'window:quantity:1=500', 'tol:quantity:1=0.5 %', 'scale:quantity:1?'],
  relaxation: ['scheme:string="SIMPLE"{SIMPLE|SIMPLEC|PISO}', 'alpha_u:quantity:1=0.7', 'alpha_p:quantity:1?', 'history:record?', 'mode:string?{monotone|alternating}', 'to_alpha_u:quantity:1?'],
  gci: ['phi:list:any', 'cells:list:1?', 'h:list:any?', 'dim:quantity:1=3'],
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
