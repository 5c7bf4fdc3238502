// Worksheet entries for fluid properties and similarity numbers. The physics
// lives in the neighbouring files as functions of SI numbers; here arguments
// are read, results are given units, and each record says how it was made.
import { bareNumber, fluidArg, optionalSi, passThrough, siArg, type FluidProps } from '../shared/args.js';
import { fieldRecord } from '../shared/records.js';
import type { Args, FieldSpec, TradeFunction } from '../shared/registry.js';
import { TradeError } from '../shared/trade-error.js';
import { num, si, str, type Value } from '../shared/values.js';
import { airProperties, SUTHERLAND_RANGE_K } from './air.js';
import { atmosphereAt, GEOMETRIC_TOP, GEOPOTENTIAL_TOP } from './atmosphere.js';
import { compressibilityWarnings } from '../shared/flow.js';
import { dynamicPressure, flatPlateRegime, machNumber, reynoldsNumber } from './regime.js';
import { SEAWATER_S_MAX, seawaterProperties } from './seawater.js';
import { waterProperties } from './water.js';
import { celsiusText, exactText, numberText } from '../shared/words.js';

const FLUID = 'fluid';

// The fields a fluid record may have, declared once; each entry lists its own in the order shown.
const RHO: FieldSpec = { name: 'rho', symbol: '\\rho', unit: 'kg/m^3', doc: 'density' };
const MU: FieldSpec = { name: 'mu', symbol: '\\mu', unit: 'Pa s', doc: 'dynamic viscosity' };
const NU: FieldSpec = { name: 'nu', symbol: '\\nu', unit: 'm^2/s', doc: 'kinematic viscosity' };
const SOUND: FieldSpec = { name: 'a', symbol: 'a', unit: 'm/s', doc: 'speed of sound' };
const TEMPERATURE: FieldSpec = { name: 'T', symbol: 'T', unit: 'K', doc: 'temperature' };
const PRESSURE: FieldSpec = { name: 'p', symbol: 'p', unit: 'Pa', doc: 'pressure' };

const AIR_FIELDS: readonly FieldSpec[] = [RHO, MU, NU, SOUND, TEMPERATURE, PRESSURE];
const ATMOSPHERE_FIELDS: readonly FieldSpec[] = [
  TEMPERATURE,
  PRESSURE,
  RHO,
  MU,
  NU,
  SOUND,
  { name: 'H', symbol: 'H', unit: 'm', doc: 'geopotential altitude' },
  { name: 'Z', symbol: 'Z', unit: 'm', doc: 'geometric altitude' },
];
const WATER_FIELDS: readonly FieldSpec[] = [RHO, MU, NU, TEMPERATURE];
const SEAWATER_FIELDS: readonly FieldSpec[] = [RHO, MU, NU, TEMPERATURE, { name: 'S', symbol: 'S', unit: '1', doc: 'salinity' }];
const FLUID_FIELDS: readonly FieldSpec[] = [RHO, MU, NU, SOUND];

/** Density, viscosities and (where known) the speed of sound, as a fluid record's values. */
function properties(rho: number, mu: number, nu: number, a?: number): Record<string, Value | undefined> {
  return { rho: si(rho, 'kg/m^3'), mu: si(mu, 'Pa s'), nu: si(nu, 'm^2/s'), a: a === undefined ? undefined : si(a, 'm/s') };
}

const air: TradeFunction = {
  name: 'air',
  params: [
    { name: 'T', type: 'quantity', unit: 'K', doc: 'temperature' },
    { name: 'p', type: 'quantity', unit: 'Pa', default: '101325 Pa', doc: 'absolute pressure' },
    { name: 'RH', type: 'quantity', unit: '1', default: '0 %', doc: 'relative humidity' },
  ],
  fields: AIR_FIELDS,
  doc: 'air as an ideal gas: density, viscosity and speed of sound (humid air by partial pressures)',
  source:
    'Ideal gas with R = R*/M0 = 287.05 J/(kg K) and Sutherland viscosity (beta = 1.458e-6 kg/(m s K^0.5), S = 110.4 K), ' +
    'both from the U.S. Standard Atmosphere 1976; a = sqrt(1.4 R T); water-vapour saturation pressure by IAPWS-IF97 (IAPWS R7-97(2012)), Eq. 30',
  example: 'air(T: 20 degC, RH: 50 %)',
  compute(args) {
    const T = siArg(args, 'T', 'K');
    const p = siArg(args, 'p', 'Pa');
    const RH = siArg(args, 'RH');
    if (RH > 1 && bareNumber(args, 'RH')) {
      throw new TradeError(`RH = ${exactText(RH)} has no unit, so it reads as ${exactText(RH * 100)} %; write it with its unit, e.g. RH: ${exactText(RH)} %`);
    }
    const air = airProperties(T, p, RH);
    const warnings: string[] = [];
    if (T < SUTHERLAND_RANGE_K[0] || T > SUTHERLAND_RANGE_K[1]) {
      warnings.push(`T = ${celsiusText(T)} is outside ${SUTHERLAND_RANGE_K[0]} to ${SUTHERLAND_RANGE_K[1]} K, where Sutherland's law holds within about 2 %`);
    }
    const remarks = ["Ideal gas, R = 287.05 J/(kg K); Sutherland's law with the U.S. Standard Atmosphere 1976 constants; a = \u221a(\u03b3RT), \u03b3 = 1.4."];
    if (RH > 0) {
      remarks.push(
        `Humid air: density from the partial pressures of dry air and vapour, p_v = RH \u00b7 p_sat(T) = ${numberText(air.vapourPressure, { digits: 4 })} Pa with p_sat from IAPWS-IF97. ` +
          'Neglected: the enhancement factor and non-ideal behaviour (each well under 0.1 % in density near room conditions), ' +
          'and the effect of the vapour on viscosity and on the speed of sound (both taken as for dry air).',
      );
    }
    return fieldRecord(AIR_FIELDS, { ...properties(air.rho, air.mu, air.nu, air.a), T: passThrough(args, 'T'), p: passThrough(args, 'p') }, { warnings, remarks, tag: FLUID });
  },
};

const atmosphere: TradeFunction = {
  name: 'atmosphere',
  params: [
    { name: 'geopotential', type: 'quantity', unit: 'm', optional: true, doc: `geopotential altitude H, 0 to ${GEOPOTENTIAL_TOP / 1000} km (what a bare first argument is)` },
    { name: 'geometric', type: 'quantity', unit: 'm', optional: true, doc: `geometric altitude Z above sea level, 0 to ${GEOMETRIC_TOP / 1000} km, as handbook tables and aircraft data give it` },
  ],
  fields: ATMOSPHERE_FIELDS,
  doc: 'the International Standard Atmosphere from 0 to 20 km geopotential, at a geopotential or a geometric altitude',
  source:
    "ISO 2533:1975 International Standard Atmosphere (identical to the U.S. Standard Atmosphere 1976 up to 20 km); H = r0 Z/(r0 + Z), r0 = 6 356 766 m (USSA-1976); viscosity by Sutherland's law with its constants",
  example: 'atmosphere(geometric: 3000 m)',
  compute(args) {
    const H = optionalSi(args, 'geopotential', 'm');
    const Z = optionalSi(args, 'geometric', 'm');
    if ((H === undefined) === (Z === undefined)) {
      throw new TradeError(H === undefined ? 'give an altitude: geopotential: … or geometric: …' : 'give the altitude once: geopotential or geometric, not both');
    }
    const s = atmosphereAt(H === undefined ? { geometric: Z! } : { geopotential: H });
    const m = (x: number) => `${numberText(x, { digits: 6 })} m`;
    const given = H === undefined ? `geometric altitude Z = ${m(s.Z)} (geopotential H = ${m(s.H)})` : `geopotential altitude H = ${m(s.H)} (geometric Z = ${m(s.Z)})`;
    return fieldRecord(
      ATMOSPHERE_FIELDS,
      { T: si(s.T, 'K'), p: si(s.p, 'Pa'), ...properties(s.rho, s.mu, s.nu, s.a), H: si(s.H, 'm'), Z: si(s.Z, 'm') },
      { remarks: [`International Standard Atmosphere (ISO 2533:1975), dry air, at ${given}.`], tag: FLUID },
    );
  },
};

const water: TradeFunction = {
  name: 'water',
  params: [
    { name: 'T', type: 'quantity', unit: 'K', doc: 'temperature, 0 to 100 \u00b0C' },
    { name: 'p', type: 'quantity', unit: 'Pa', default: '101325 Pa', doc: 'absolute pressure' },
  ],
  fields: WATER_FIELDS,
  doc: 'liquid fresh water from 0 to 100 \u00b0C: density and viscosity',
  source: 'Density by IAPWS-IF97 region 1 (IAPWS R7-97(2012)); viscosity by IAPWS R12-08 (2008), without the critical enhancement',
  example: 'water(15 degC)',
  compute(args) {
    const w = waterProperties(siArg(args, 'T', 'K'), siArg(args, 'p', 'Pa'));
    return fieldRecord(WATER_FIELDS, { ...properties(w.rho, w.mu, w.nu), T: passThrough(args, 'T') }, {
      remarks: ['Pure liquid water: density by IAPWS-IF97 (region 1), viscosity by the IAPWS 2008 formulation (R12-08). Dissolved air and impurities are neglected.'],
      tag: FLUID,
    });
  },
};

const seawater: TradeFunction = {
  name: 'seawater',
  params: [
    { name: 'T', type: 'quantity', unit: 'K', doc: 'temperature, 0 to 100 \u00b0C' },
    { name: 'S', type: 'quantity', unit: '1', default: '35 g/kg', doc: 'salinity (mass of salt per mass of seawater)' },
  ],
  fields: SEAWATER_FIELDS,
  doc: 'seawater at atmospheric pressure: density and viscosity',
  source: 'Sharqawy, Lienhard and Zubair (2010), Thermophysical properties of seawater, Desalination and Water Treatment 16, 354-380: density Eq. 8, viscosity Eqs. 22-23',
  example: 'seawater(10 degC, S: 35 g/kg)',
  compute(args) {
    const S = siArg(args, 'S');
    if (S > SEAWATER_S_MAX && bareNumber(args, 'S')) {
      throw new TradeError(`S = ${exactText(S)} has no unit, so it reads as ${exactText(S * 1000)} g/kg; write salinity with its unit, e.g. S: ${exactText(S)} g/kg`);
    }
    const s = seawaterProperties(siArg(args, 'T', 'K'), S);
    return fieldRecord(
      SEAWATER_FIELDS,
      { ...properties(s.rho, s.mu, s.nu), T: passThrough(args, 'T'), S: passThrough(args, 'S') },
      {
        remarks: ['Seawater at atmospheric pressure by the correlations of Sharqawy, Lienhard and Zubair (2010); stated accuracy about 0.1 % in density and 1.5 % in viscosity.'],
        tag: FLUID,
      },
    );
  },
};

const fluid: TradeFunction = {
  name: 'fluid',
  params: [
    { name: 'rho', type: 'quantity', unit: 'kg/m^3', doc: 'density' },
    { name: 'mu', type: 'quantity', unit: 'Pa s', doc: 'dynamic viscosity' },
    { name: 'a', type: 'quantity', unit: 'm/s', optional: true, doc: 'speed of sound, for Mach numbers' },
  ],
  fields: FLUID_FIELDS,
  doc: 'a fluid of your own from its density and viscosity (nu = mu/rho)',
  source: 'definition of kinematic viscosity, nu = mu/rho',
  example: 'fluid(rho: 870 kg/m^3, mu: 0.03 Pa s)',
  compute(args) {
    const rho = siArg(args, 'rho', 'kg/m^3');
    const mu = siArg(args, 'mu', 'Pa s');
    const a = optionalSi(args, 'a', 'm/s');
    if (!(rho > 0)) throw new TradeError(`rho = ${exactText(rho)} kg/m^3: the density must be above zero`);
    if (!(mu > 0)) throw new TradeError(`mu = ${exactText(mu)} Pa s: the viscosity must be above zero`);
    if (a !== undefined && !(a > 0)) throw new TradeError(`a = ${exactText(a)} m/s: the speed of sound must be above zero`);
    return fieldRecord(FLUID_FIELDS, properties(rho, mu, mu / rho, a), { remarks: ['Fluid properties given by the sheet.'], tag: FLUID });
  },
};

/** nu from either a fluid record or a nu argument, never both. */
function kinematicViscosity(args: Args): number {
  const hasFluid = args['fluid'] !== undefined;
  const hasNu = args['nu'] !== undefined;
  if (hasFluid === hasNu) {
    throw new TradeError(hasFluid ? 'give either a fluid or nu, not both' : 'missing argument: give a fluid (such as air(T: 20 degC)) or nu');
  }
  return hasFluid ? fluidArg(args).nu : siArg(args, 'nu', 'm^2/s');
}

function speedOfSound(f: FluidProps, fn: string): number {
  if (f.a === undefined) {
    throw new TradeError(`${fn}() needs a fluid with a speed of sound a, such as air() or atmosphere(); fluid(rho, mu, a: …) also takes one`);
  }
  return f.a;
}

const U_PARAM = { name: 'U', type: 'quantity', unit: 'm/s', doc: 'flow speed' } as const;
const L_PARAM = { name: 'L', type: 'quantity', unit: 'm', doc: 'length along the flow' } as const;
const FLUID_PARAM = { name: 'fluid', type: 'fluid', doc: 'a fluid record (air(), water(), fluid() …)' } as const;

const reynolds: TradeFunction = {
  name: 'reynolds',
  params: [U_PARAM, L_PARAM, { ...FLUID_PARAM, optional: true }, { name: 'nu', type: 'quantity', unit: 'm^2/s', optional: true, doc: 'kinematic viscosity, instead of a fluid' }],
  returns: { symbol: '\\mathrm{Re}', unit: '1', doc: 'the Reynolds number on L' },
  doc: 'Reynolds number Re = U L / nu',
  source: 'definition (Reynolds 1883)',
  example: 'reynolds(30 m/s, 4 m, air(T: 20 degC))',
  compute(args) {
    return num(reynoldsNumber(siArg(args, 'U', 'm/s'), siArg(args, 'L', 'm'), kinematicViscosity(args)));
  },
};

const mach: TradeFunction = {
  name: 'mach',
  params: [U_PARAM, FLUID_PARAM],
  returns: { symbol: '\\mathrm{Ma}', unit: '1', doc: 'the Mach number' },
  doc: 'Mach number Ma = U / a',
  source: 'definition; compressibility flag above Ma 0.3 is common practice',
  example: 'mach(100 m/s, air(T: 15 degC))',
  compute(args, ctx) {
    const Ma = machNumber(siArg(args, 'U', 'm/s'), speedOfSound(fluidArg(args), 'mach'));
    for (const w of compressibilityWarnings(Ma)) ctx.warn(w);
    return num(Ma);
  },
};

const dynamic_pressure: TradeFunction = {
  name: 'dynamic_pressure',
  params: [U_PARAM, FLUID_PARAM],
  returns: { symbol: 'q', unit: 'Pa', doc: 'the dynamic pressure' },
  doc: 'dynamic pressure q = rho U\u00b2 / 2',
  source: 'definition (Bernoulli)',
  example: 'dynamic_pressure(30 m/s, air(T: 20 degC))',
  compute(args) {
    return si(dynamicPressure(siArg(args, 'U', 'm/s'), fluidArg(args).rho), 'Pa');
  },
};

const REGIME_FIELDS: readonly FieldSpec[] = [
  { name: 'Re', symbol: '\\mathrm{Re}', unit: '1', doc: 'Reynolds number on L' },
  { name: 'Ma', symbol: '\\mathrm{Ma}', unit: '1', doc: 'Mach number (when the fluid has a speed of sound)' },
  { name: 'q', symbol: 'q', unit: 'Pa', doc: 'dynamic pressure' },
  { name: 'regime', symbol: '', unit: 'text', doc: 'flat-plate boundary layer at L' },
];

const flow_regime: TradeFunction = {
  name: 'flow_regime',
  params: [U_PARAM, L_PARAM, FLUID_PARAM],
  fields: REGIME_FIELDS,
  doc: 'Reynolds and Mach numbers, dynamic pressure, and the flat-plate regime in plain words',
  source: 'Re, Ma and q by definition; transition near Re_x = 5e5 on a smooth flat plate and compressibility above Ma 0.3 are common practice',
  example: 'flow_regime(30 m/s, 4 m, air(T: 20 degC))',
  compute(args) {
    const U = siArg(args, 'U', 'm/s');
    const f = fluidArg(args);
    const Re = reynoldsNumber(U, siArg(args, 'L', 'm'), f.nu);
    const verdict = flatPlateRegime(Re);
    const values: Record<string, Value> = { Re: num(Re), q: si(dynamicPressure(U, f.rho), 'Pa'), regime: str(verdict.regime) };
    const warnings: string[] = [];
    const remarks = [`${verdict.explanation} (flat-plate transition near Re_x = 5\u00d710\u2075, common practice; roughness or a disturbed stream bring it earlier).`];
    if (f.a !== undefined) {
      const Ma = machNumber(U, f.a);
      values['Ma'] = num(Ma);
      warnings.push(...compressibilityWarnings(Ma));
    } else {
      remarks.push('The fluid record has no speed of sound a, so no Mach number is given (in water a is near 1500 m/s).');
    }
    return fieldRecord(REGIME_FIELDS, values, { warnings, remarks }, { Ma: 'Mach number' });
  },
};

export const fluidEntries: TradeFunction[] = [air, atmosphere, water, seawater, fluid, reynolds, mach, dynamic_pressure, flow_regime];
