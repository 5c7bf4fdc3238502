// The convergence family's worksheet entries: what a run's histories say after
// (or during) the run — residuals, monitored quantities, under-relaxation —
// and the grid convergence index of a three-grid study. The maths lives in the
// sibling files as functions of plain numbers; here arguments are read and
// results get their units, words and figures.
import { quantity, type Quantity } from '../../units/quantity.js';
import { dimsEqual } from '../../units/dims.js';
import { unitLabel } from '../../units/labels.js';
import { choiceArg, optionalRecord, optionalSi, siArg, siListArg, stringArg } from '../shared/args.js';
import { ANY_DIMENSION, type Args, type FieldSpec, type TradeFunction } from '../shared/registry.js';
import { TradeError } from '../shared/trade-error.js';
import { fieldRecord } from '../shared/records.js';
import { bool, describeValue, figure, num, shown, str, table, type RecordValue, type Value } from '../shared/values.js';
import { numberText, percentText, quotedList } from '../shared/words.js';
import { ASYMPTOTIC_TOLERANCE, cellSizes, gci as gciOf, MIN_RATIO, SAFETY_FACTOR } from './gci.js';
import { readHistory, unfinishedRemark, type History } from './history-file.js';
import { MONITOR_SPAN_WINDOWS, monitorPlot, residualPlot } from './history-plots.js';
import { monitorStats } from './monitor.js';
import {
  checkAlpha,
  dampedFactor,
  MODES,
  pairedPressure,
  pairingNote,
  pairingRemark,
  pairingSource,
  recommend,
  SCHEMES,
  stableAlphaLimit,
  undampedFactor,
  type Mode,
} from './relaxation.js';
import { assessField, factorText, verdictRules, VERDICTS, worstField, type FieldAssessment, type ResidualOptions, type Verdict } from './residual-history.js';

const PATH = { name: 'path', type: 'string', doc: 'CSV the solver writes, relative to the sheet: the iteration column first (header row; comma, semicolon or tab)' } as const;

function positive(name: string, v: number): number {
  if (!(v > 0) || !Number.isFinite(v)) throw new TradeError(`${name} must be above zero, not ${numberText(v)}`);
  return v;
}

// ---------------------------------------------------------------- residuals

const RESIDUAL_FIELDS: readonly FieldSpec[] = [
  { name: 'table', symbol: '\\mathbf{R}', unit: 'table', doc: 'one row per field: initial, final, drop, factor, remaining, verdict' },
  { name: 'verdict', symbol: '\\text{verdict}', unit: 'text', doc: "the whole run: its worst field's verdict" },
  { name: 'worst', symbol: '\\text{worst}', unit: 'text', doc: 'the field that decides the verdict' },
  { name: 'factor', symbol: '\\rho', unit: '1', doc: "the worst field's convergence factor per iteration" },
  { name: 'iterations', symbol: 'n', unit: '1', doc: 'last iteration read' },
];

const REMAINING_WORDS: Record<Verdict, string> = {
  converged: '0',
  converging: '',
  stalled: 'not at this rate',
  oscillating: 'unclear (oscillating)',
  diverging: 'not at this rate',
};

/** What to do about a field in trouble (common practice), after its verdict and reason. */
const ACTION: Partial<Record<Verdict, string>> = {
  diverging: 'stop the run and look at the mesh, the boundary conditions and the under-relaxation factors (relaxation(history: …) suggests new ones)',
  oscillating: 'lower the under-relaxation factors; if the flow itself is unsteady (vortex shedding), run it time-accurate instead',
  stalled: 'the residual has reached a plateau: check whether the flow is unsteady or the mesh sets a floor; more iterations will not help',
};

const residuals: TradeFunction = {
  name: 'residuals',
  params: [
    PATH,
    { name: 'target_drop', type: 'quantity', unit: '1', default: '4', doc: 'orders of magnitude each residual should fall' },
    { name: 'window', type: 'quantity', unit: '1', default: '200', doc: 'trailing iterations the convergence factor is fitted over' },
    { name: 'initial', type: 'quantity', unit: '1', default: '5', doc: 'the initial value is the largest of the first this many values written (1: the very first)' },
  ],
  fields: RESIDUAL_FIELDS,
  doc: 'judges a residual history: per field the drop in orders of magnitude, the convergence factor, the iterations remaining and a verdict; a log-scale plot',
  source:
    'drop = log10(initial/final); asymptotic convergence factor from a least-squares fit of log10 residual over a trailing window (linear iteration error ∝ ρ^n: Ferziger & Perić, Computational Methods for Fluid Dynamics, 2002, ch. 5, from memory); verdict thresholds stated on the sheet',
  example: 'residuals("../data/towed-body-residuals.csv", target_drop: 4, window: 200)',
  compute(args, ctx) {
    const path = stringArg(args, 'path');
    const opts: ResidualOptions = {
      targetDrop: positive('target_drop', siArg(args, 'target_drop')),
      window: positive('window', siArg(args, 'window')),
      initialCount: positive('initial', siArg(args, 'initial')),
    };
    if (!Number.isInteger(opts.initialCount)) throw new TradeError(`initial must be a whole number of values, not ${numberText(opts.initialCount)}`);
    const h = readHistory(ctx.readData(path));
    const fields = h.columns.map((c) => assessField(c.name, h.iterations, c.values, h.lines, opts));
    const worst = worstField(fields);
    const rows: Value[][] = fields.map((f) => [
      str(f.field),
      num(f.initial),
      num(f.final),
      num(f.drop),
      str(factorText(f.factor)),
      f.remaining === null ? str(REMAINING_WORDS[f.verdict]) : num(f.remaining),
      str(f.verdict),
    ]);
    const last = h.iterations[h.rows - 1]!;
    return fieldRecord(
      RESIDUAL_FIELDS,
      {
        table: table(['field', 'initial', 'final', 'drop', 'factor', 'remaining', 'verdict'], rows),
        verdict: str(worst.verdict),
        worst: str(worst.field),
        factor: num(worst.factor),
        iterations: num(last),
      },
      {
        warnings: residualWarnings(fields, opts),
        remarks: residualRemarks(h, fields, opts),
        figure: figure(
          residualPlot(
            h.iterations,
            fields.map((f, i) => ({ name: f.field, values: h.columns[i]!.values, upTo: f.blowUp ? rowIndexOf(h, f.blowUp.row) : h.rows })),
            Math.max(h.iterations[0]!, last - opts.window),
          ),
          `Residuals from ${path}, iterations ${numberText(h.iterations[0]!)} to ${numberText(last)}; the dashed line starts the fit window`,
        ),
        tag: 'residuals',
      },
      { factor: `factor of ${worst.field}: ${factorText(worst.factor)} per iteration` },
    );
  },
};

function rowIndexOf(h: History, row: number): number {
  const k = h.lines.indexOf(row);
  return k < 0 ? h.rows : k;
}

function residualWarnings(fields: readonly FieldAssessment[], opts: ResidualOptions): string[] {
  const w: string[] = [];
  for (const f of fields) {
    const action = ACTION[f.verdict];
    if (action) w.push(`${f.field} is ${f.verdict}: ${f.reason}. ${action[0]!.toUpperCase()}${action.slice(1)}.`);
    if (f.widened) w.push(`the last ${numberText(opts.window)} iterations hold fewer than 3 values of ${f.field}, so its last ${f.fitRows} were fitted: widen window.`);
  }
  return w;
}

function residualRemarks(h: History, fields: readonly FieldAssessment[], opts: ResidualOptions): string[] {
  const r: string[] = [];
  for (const f of fields) if (!ACTION[f.verdict]) r.push(`${f.field}: ${f.verdict} — ${f.reason}.`);
  r.push(...verdictRules(opts));
  for (const f of fields) {
    if (f.zeros > 0) r.push(`${f.field} has ${f.zeros} value${f.zeros === 1 ? '' : 's'} of exactly zero: zero has no logarithm, so ${f.zeros === 1 ? 'it is' : 'they are'} left out of the drop, the fit and the plot.`);
  }
  const unfinished = unfinishedRemark(h);
  if (unfinished) r.push(unfinished);
  return r;
}

// ---------------------------------------------------------------- monitor

const MONITOR_FIELDS: readonly FieldSpec[] = [
  { name: 'mean', symbol: '\\bar{\\phi}', unit: '1', doc: 'mean over the trailing window' },
  { name: 'std', symbol: 's_{\\phi}', unit: '1', doc: 'sample standard deviation over the window' },
  { name: 'drift', symbol: '\\delta', unit: '1', doc: 'second-half mean − first-half mean, relative to the mean' },
  { name: 'verdict', symbol: '\\text{verdict}', unit: 'text', doc: 'settled, drifting, or too short' },
];

const monitor: TradeFunction = {
  name: 'monitor',
  params: [
    PATH,
    { name: 'column', type: 'string', optional: true, doc: 'the monitored column by its header name (default: the first after the iteration)' },
    { name: 'window', type: 'quantity', unit: '1', default: '500', doc: 'trailing iterations judged' },
    { name: 'tol', type: 'quantity', unit: '1', default: '0.5 %', doc: 'largest drift between the two halves of the window for a settled value' },
    { name: 'scale', type: 'quantity', unit: '1', optional: true, doc: 'reference size for the drift instead of the mean (for a value that averages near zero)' },
  ],
  fields: MONITOR_FIELDS,
  doc: 'a monitored quantity over the trailing window: mean, standard deviation, drift between the halves, and whether it has settled; a plot',
  source: 'drift between the means of the two halves of the trailing window, relative to the mean, against a tolerance: common practice for judging that a force coefficient has settled',
  example: 'monitor("../data/towed-body-forces.csv", column: "Cd", window: 500, tol: 0.5 %)',
  compute(args, ctx) {
    const path = stringArg(args, 'path');
    const window = positive('window', siArg(args, 'window'));
    const tol = positive('tol', siArg(args, 'tol'));
    const scale = optionalSi(args, 'scale');
    if (scale !== undefined) positive('scale', scale);
    const h = readHistory(ctx.readData(path));
    const column = args['column'] === undefined ? h.columns[0]! : findColumn(h, stringArg(args, 'column'));
    const st = monitorStats(column.name, h.iterations, column.values, h.lines, window, tol, scale);
    const name = column.name;
    const relStd = st.std / st.reference;
    const relative = scale === undefined ? 'the mean' : `the scale ${numberText(scale)}`;
    const warnings: string[] = [];
    if (st.verdict === 'too short') {
      warnings.push(`the run has written only iterations ${numberText(h.iterations[0]!)} to ${numberText(st.lastIteration)}, fewer than the window of ${numberText(window)}: run on before judging ${name}.`);
    } else if (st.verdict === 'drifting') {
      warnings.push(`${name} drifts by ${percentText(st.drift)} of ${relative} between the halves of the last ${numberText(window)} iterations, beyond ${percentText(tol)}: it has not settled, so run on.`);
    }
    if (scale === undefined && Math.abs(st.mean) < st.std) {
      warnings.push(`the mean of ${name} (${numberText(st.mean)}) is small against its swings (standard deviation ${numberText(st.std)}), so a drift relative to the mean says little: give scale: (a typical size of ${name}).`);
    } else if (relStd > tol) {
      warnings.push(
        `${name} swings with a standard deviation of ${percentText(relStd)} of ${relative}, more than ${percentText(tol)}: report the window mean, not the last value. ` +
          'Swings that stay once the residuals have fallen may mean unsteady flow, for which a time-accurate run averaged over whole cycles is usual (common practice).',
      );
    }
    const remarks = [
      `Over iterations ${numberText(st.windowStart)} to ${numberText(st.lastIteration)} (${st.windowRows} rows): first-half mean ${numberText(st.firstHalfMean, { digits: 5 })}, second-half mean ${numberText(st.secondHalfMean, { digits: 5 })}${st.windowRows % 2 ? '; the middle row belongs to neither half' : ''}.`,
      `drift = (second-half mean − first-half mean) / ${scale === undefined ? '|mean|' : 'scale'}; settled when |drift| ≤ ${percentText(tol)} (common practice: a monitored value that no longer moves, together with residuals that have fallen).`,
    ];
    const unfinished = unfinishedRemark(h);
    if (unfinished) remarks.push(unfinished);
    return fieldRecord(
      MONITOR_FIELDS,
      { mean: num(st.mean), std: num(st.std), drift: shown(st.drift * 100, '%'), verdict: str(st.verdict) },
      {
        warnings,
        remarks,
        figure: figure(
          monitorPlot(h.iterations, name, column.values, window, st.windowStart, st.mean, tol * st.reference, tol, scale === undefined ? '' : ' of scale'),
          `${name} from ${path}, the last ${numberText(MONITOR_SPAN_WINDOWS * window)} iterations; the dashed lines mark the window and the band of ± ${percentText(tol)} of ${relative} about the mean`,
        ),
        tag: 'monitor',
      },
      { drift: `second-half mean − first-half mean, relative to ${scale === undefined ? 'the mean' : 'the scale'}` },
    );
  },
};

function findColumn(h: History, name: string) {
  const wanted = name.toLowerCase();
  const found = h.columns.find((c) => c.name.toLowerCase() === wanted);
  if (!found) {
    const first = h.iterationName.toLowerCase() === wanted ? ` (${h.iterationName} is the iteration column)` : '';
    throw new TradeError(`no column "${name}" to monitor${first}; the columns after the iteration are ${h.columns.map((c) => c.name).join(', ')}`);
  }
  return found;
}

// ---------------------------------------------------------------- relaxation

const RELAXATION_FIELDS: readonly FieldSpec[] = [
  { name: 'alpha_u', symbol: '\\alpha_u', unit: '1', doc: 'momentum (velocity) under-relaxation factor' },
  { name: 'alpha_p', symbol: '\\alpha_p', unit: '1', doc: 'pressure under-relaxation factor' },
  { name: 'note', symbol: '\\text{note}', unit: 'text', doc: 'how the pair goes together' },
  { name: 'advice', symbol: '\\text{advice}', unit: 'text', doc: 'lower, raise or keep, from the history' },
  { name: 'next_alpha_u', symbol: "\\alpha_u'", unit: '1', doc: 'recommended momentum factor' },
  { name: 'next_alpha_p', symbol: "\\alpha_p'", unit: '1', doc: 'recommended pressure factor' },
  { name: 'factor', symbol: '\\rho', unit: '1', doc: 'measured convergence factor per iteration (worst field)' },
  { name: 'lambda', symbol: '\\lambda', unit: '1', doc: 'undamped error amplification of the model (estimate)' },
  { name: 'next_factor', symbol: "\\rho'", unit: '1', doc: 'estimated factor at the new α_u (damped fixed-point model)' },
];

const relaxation: TradeFunction = {
  name: 'relaxation',
  params: [
    { name: 'scheme', type: 'string', default: '"SIMPLE"', choices: SCHEMES, doc: 'pressure–velocity coupling: SIMPLE, SIMPLEC or PISO' },
    { name: 'alpha_u', type: 'quantity', unit: '1', default: '0.7', doc: 'momentum under-relaxation factor, 0 < α ≤ 1' },
    { name: 'alpha_p', type: 'quantity', unit: '1', optional: true, doc: "pressure factor, if not the scheme's usual pairing" },
    { name: 'history', type: 'record', optional: true, doc: 'a residuals(…) record of a run made with these factors' },
    { name: 'mode', type: 'string', optional: true, choices: MODES, doc: 'for the estimate: whether the error keeps its sign (monotone) or flips every iteration (alternating); by default alternating only when the history oscillates' },
    { name: 'to_alpha_u', type: 'quantity', unit: '1', optional: true, doc: 'estimate the factor at this α_u instead of the recommended one' },
  ],
  fields: RELAXATION_FIELDS,
  doc: 'under-relaxation factors for a pressure–velocity scheme, and from a residual history a recommended change with an estimate of the new convergence factor',
  source:
    'φ_new = φ_old + α(φ_computed − φ_old) (Patankar, Numerical Heat Transfer and Fluid Flow, 1980); α_p = 1 − α_u for SIMPLE (Ferziger & Perić, Computational Methods for Fluid Dynamics, 2002, ch. 7, from memory); SIMPLEC and PISO values common practice; damped fixed-point model |1 − α(1 − λ)| as an estimate',
  example: 'relaxation(scheme: "SIMPLE", alpha_u: 0.7)',
  compute(args) {
    const scheme = choiceArg(args, 'scheme', SCHEMES);
    const alphaU = siArg(args, 'alpha_u');
    checkAlpha('alpha_u', alphaU);
    const givenP = optionalSi(args, 'alpha_p');
    if (givenP !== undefined) checkAlpha('alpha_p', givenP);
    const paired = pairedPressure(scheme, alphaU);
    const alphaP = givenP ?? paired;
    const warnings: string[] = [];
    const remarks = [
      'Under-relaxed update: φ_new = φ_old + α (φ_computed − φ_old); α = 1 takes the computed value whole, a smaller α a share of the change (Patankar 1980).',
      pairingRemark(scheme),
    ];
    if (scheme === 'SIMPLE' && alphaU === 1 && givenP === undefined) throw new TradeError('SIMPLE with α_u = 1 leaves α_p = 1 − α_u = 0: the pressure would never change; take α_u below 1');
    if (paired > 0 && givenP !== undefined && Math.abs(givenP - paired) > 0.05) {
      warnings.push(`${scheme} usually pairs α_u ${numberText(alphaU)} with α_p ${numberText(paired)} (${pairingNote(scheme)}); α_p ${numberText(givenP)} was given.`);
    }
    if (scheme === 'SIMPLE' && alphaU > 0.9 && givenP === undefined) warnings.push(`with α_u ${numberText(alphaU)}, α_p = 1 − α_u is only ${numberText(paired)}: the pressure field will move very slowly (common practice keeps α_u at or below about 0.8–0.9).`);
    if (alphaU < 0.3) warnings.push(`α_u ${numberText(alphaU)} is very low: each iteration takes under a third of the change, so the run will crawl (common practice stays at or above about 0.3).`);
    if (scheme === 'PISO' && alphaU < 1) remarks.push('PISO in a time-accurate run is usually left unrelaxed (α_u = 1); factors below 1 belong to runs with outer iterations per time step, and a smaller time step is the usual remedy for trouble.');

    const values: Record<string, Value> = { alpha_u: num(alphaU), alpha_p: num(alphaP), note: str(pairingNote(scheme)) };
    const history = optionalRecord(args, 'history');
    const toAlpha = optionalSi(args, 'to_alpha_u');
    if (toAlpha !== undefined) checkAlpha('to_alpha_u', toAlpha);
    const notes: Record<string, string> = { note: pairingSource(scheme) };
    if (history) {
      const { verdict, factor, worst } = readResidualRecord(history);
      const rec = recommend(scheme, verdict, factor, alphaU);
      const nextP = givenP === undefined ? pairedPressure(scheme, rec.alphaU) : Math.min(1, givenP * (rec.alphaU / alphaU));
      Object.assign(values, { advice: str(rec.advice), next_alpha_u: num(rec.alphaU), next_alpha_p: num(nextP), factor: num(factor) });
      notes['factor'] = `measured for ${worst}: ${factorText(factor)} per iteration`;
      remarks.push(`Advice (${rec.advice}): ${rec.reason}.`);
      if (scheme === 'SIMPLE' && givenP === undefined && rec.advice !== 'keep') remarks.push(`For SIMPLE α_p follows α_u as 1 − α_u (Ferziger and Perić), so α_p moves the other way: ${numberText(alphaP)} → ${numberText(nextP)}.`);
      if (verdict === 'diverging' && factor < 1) {
        // A run that blew up (nan) or rose above its start after falling: its trailing factor describes the fall, not the trouble.
        remarks.push(`No estimate: ${worst} is diverging although its trailing factor (${factorText(factor)}) is below 1, so the factor says nothing about the divergence.`);
      } else {
        const mode: Mode = args['mode'] === undefined ? (verdict === 'oscillating' ? 'alternating' : 'monotone') : choiceArg(args, 'mode', MODES);
        const lambda = undampedFactor(factor, alphaU, mode);
        const at = toAlpha ?? rec.alphaU;
        const nextFactor = dampedFactor(lambda, at);
        notes['next_factor'] = `estimated factor at α_u ${numberText(at)} (damped fixed-point model)`;
        Object.assign(values, { lambda: num(lambda), next_factor: num(nextFactor) });
        remarks.push(...modelRemarks(factor, alphaU, mode, lambda, at, nextFactor, worst));
        if (mode === 'monotone' && lambda >= 1) {
          // At λ = 1 the damped factor 1 − α (1 − λ) is 1 for every α: the error neither grows nor shrinks.
          const what = lambda > 1 ? 'grows by itself' : 'keeps its size';
          const relaxing = lambda > 1 ? 'only slows the growth, no factor stops it' : 'leaves the factor at 1 whatever its value';
          warnings.push(`in the model this run's error ${what} (λ = ${numberText(lambda, { digits: 4 })}${lambda > 1 ? ' > 1' : ''}): under-relaxation ${relaxing}; look at the mesh, the boundary conditions or the time step.`);
        }
      }
    } else if (toAlpha !== undefined || args['mode'] !== undefined) {
      throw new TradeError('to_alpha_u and mode need history: (a residuals(…) record of a run made with alpha_u)');
    }
    return fieldRecord(RELAXATION_FIELDS, values, { warnings, remarks, tag: 'relaxation' }, notes);
  },
};

function modelRemarks(factor: number, alphaU: number, mode: Mode, lambda: number, at: number, nextFactor: number, worst: string): string[] {
  const sign = mode === 'monotone' ? '+ρ' : '−ρ';
  const limit = stableAlphaLimit(lambda);
  const best = 1 / (1 - lambda);
  let range: string;
  if (limit === null) range = 'In this model no α makes the factor fall below 1.';
  else if (best >= 1) range = 'In this model every α_u up to 1 converges, and the larger α_u the faster.';
  else if (limit > 1) range = `In this model every α_u up to 1 converges, fastest near ${numberText(best, { digits: 2 })}.`;
  else range = `In this model the iteration converges for α_u below ${numberText(limit, { digits: 3 })}, fastest near ${numberText(best, { digits: 2 })}.`;
  return [
    `Estimate, damped fixed-point model: an iteration φ ← φ + α (G(φ) − φ) whose undamped map G amplifies the error by λ per iteration amplifies it by 1 − α (1 − λ). ` +
      `The measured factor ρ = ${factorText(factor)} of ${worst} at α_u ${numberText(alphaU)}, taken as 1 − α (1 − λ) = ${sign} (${mode}), gives λ = ${numberText(lambda, { digits: 4 })}, and at α_u ${numberText(at)} the factor |1 − α (1 − λ)| = ${factorText(nextFactor)}.`,
    range,
    'The model treats the coupled velocity–pressure iteration as one scalar mode with one factor α = α_u; a real run couples many modes, so read it as the direction and rough size of the change, not a prediction.',
  ];
}

/** The verdict, worst field and its factor from a residuals(…) record. */
function readResidualRecord(r: RecordValue): { verdict: Verdict; factor: number; worst: string } {
  const verdict = r.fields.get('verdict')?.value;
  const factor = r.fields.get('factor')?.value;
  const worst = r.fields.get('worst')?.value;
  if (verdict?.kind !== 'string' || !(VERDICTS as readonly string[]).includes(verdict.value) || factor?.kind !== 'quantity') {
    throw new TradeError(`history must be a residuals(…) record, with a verdict (one of ${quotedList(VERDICTS)}) and a factor`);
  }
  return { verdict: verdict.value as Verdict, factor: factor.si, worst: worst?.kind === 'string' ? worst.value : 'the worst field' };
}

// ---------------------------------------------------------------- gci

const GCI_FIELDS: readonly FieldSpec[] = [
  { name: 'r21', symbol: 'r_{21}', unit: '1', doc: 'refinement ratio h2/h1' },
  { name: 'r32', symbol: 'r_{32}', unit: '1', doc: 'refinement ratio h3/h2' },
  { name: 'p', symbol: 'p', unit: '1', doc: 'observed order of convergence' },
  { name: 'phi_ext', symbol: '\\phi_{\\mathrm{ext}}^{21}', unit: 'any', doc: 'extrapolated value from grids 1 and 2' },
  { name: 'e_a', symbol: 'e_a^{21}', unit: '1', doc: 'approximate relative error |(φ1 − φ2)/φ1|' },
  { name: 'e_ext', symbol: 'e_{\\mathrm{ext}}^{21}', unit: '1', doc: 'extrapolated relative error |(φ_ext − φ1)/φ_ext|' },
  { name: 'gci_fine', symbol: '\\mathrm{GCI}_{\\mathrm{fine}}^{21}', unit: '1', doc: 'fine-grid convergence index, 1.25 e_a/(r21^p − 1)' },
  { name: 'gci_medium', symbol: '\\mathrm{GCI}^{32}', unit: '1', doc: 'the same from grids 2 and 3' },
  { name: 'ratio', symbol: '\\frac{\\mathrm{GCI}^{32}}{r_{21}^{p}\\,\\mathrm{GCI}^{21}}', unit: '1', doc: 'near 1 in the asymptotic range' },
  { name: 'asymptotic', symbol: '\\text{asymptotic}', unit: 'text', doc: `ratio within ${ASYMPTOTIC_TOLERANCE * 100} % of 1` },
  { name: 'oscillatory', symbol: '\\text{oscillatory}', unit: 'text', doc: 'the differences between grids change sign' },
];

const gci: TradeFunction = {
  name: 'gci',
  params: [
    { name: 'phi', type: 'list', unit: ANY_DIMENSION, doc: 'the key result on the fine, medium and coarse grid: [φ1, φ2, φ3]' },
    { name: 'cells', type: 'list', unit: '1', optional: true, doc: 'cell counts [N1, N2, N3], fine to coarse (or give h)' },
    { name: 'h', type: 'list', unit: ANY_DIMENSION, optional: true, doc: 'representative cell sizes [h1, h2, h3], fine to coarse (instead of cells)' },
    { name: 'dim', type: 'quantity', unit: '1', default: '3', doc: 'dimensions of the grids, for h = (1/N)^(1/dim): 1, 2 or 3' },
  ],
  fields: GCI_FIELDS,
  doc: 'grid convergence index of a three-grid study: refinement ratios, observed order, extrapolated value, relative errors, GCI and the asymptotic check',
  source:
    'Celik, Ghia, Roache, Freitas, Coleman & Raad (2008), "Procedure for estimation and reporting of uncertainty due to discretization in CFD applications", J. Fluids Eng. 130(7), 078001; observed order by fixed-point iteration, safety factor 1.25',
  example: 'gci(phi: [6.063, 5.972, 5.863], cells: [18000, 8000, 4500], dim: 2)',
  compute(args) {
    const phi = sameDimensionList(args, 'phi');
    if (phi.items.length !== 3) throw new TradeError(`phi must list three values, fine to coarse, not ${phi.items.length}`);
    const hasCells = args['cells'] !== undefined;
    const hasH = args['h'] !== undefined;
    if (hasCells === hasH) throw new TradeError(hasCells ? 'give either cells or h, not both' : 'give cells: [N1, N2, N3] (with dim) or h: [h1, h2, h3]');
    const dim = siArg(args, 'dim');
    if (![1, 2, 3].includes(dim)) throw new TradeError(`dim must be 1, 2 or 3, not ${numberText(dim)}`);
    let h: [number, number, number];
    if (hasCells) h = cellSizes(siListArg(args, 'cells'), dim);
    else {
      const hs = sameDimensionList(args, 'h').items.map((q) => q.si);
      if (hs.length !== 3) throw new TradeError(`h must list three cell sizes, fine to coarse, not ${hs.length}`);
      h = hs as [number, number, number];
    }
    const values = phi.items.map((q) => q.si) as [number, number, number];
    const g = gciOf({ phi: values, h });
    const first = phi.items[0]!;
    const warnings: string[] = [];
    for (const [name, r] of [['r21', g.r21], ['r32', g.r32]] as const) {
      if (r < MIN_RATIO) warnings.push(`${name} = ${numberText(r, { digits: 4 })} is below ${MIN_RATIO}, the least refinement ratio Celik et al. (2008) ask for: the grids differ too little for the discretization error to stand out from other errors.`);
    }
    if (g.oscillatory) warnings.push('the differences between the grids change sign (ε32/ε21 < 0): oscillatory convergence, for which Celik et al. (2008) warn that the observed order and the GCI are less reliable; add a grid or report the spread of the three values.');
    if (!g.asymptotic) warnings.push(`GCI32 / (r21^p GCI21) = ${numberText(g.ratio, { digits: 3 })} is not within ${ASYMPTOTIC_TOLERANCE * 100} % of 1: the grids are not yet in the asymptotic range, so treat the GCI as rough; refine further.`);
    const remarks = [
      hasCells ? `h = (1/N)^(1/${dim}) for grids over the same domain (Celik et al. 2008, step 1), so r = (N_fine/N_coarse)^(1/${dim}).` : 'Cell sizes as given.',
      `p from p = |ln|ε32/ε21| + q(p)| / ln r21, q(p) = ln[(r21^p − s)/(r32^p − s)], s = sign(ε32/ε21), by fixed-point iteration (${g.iterations} step${g.iterations === 1 ? '' : 's'}).`,
      `φ_ext = (r21^p φ1 − φ2)/(r21^p − 1); e_a = |(φ1 − φ2)/φ1|; e_ext = |(φ_ext − φ1)/φ_ext|; GCI_fine = ${SAFETY_FACTOR} e_a/(r21^p − 1), safety factor ${SAFETY_FACTOR} for three grids.`,
      `Asymptotic check: GCI32 ≈ r21^p GCI21, judged near 1 when the ratio is within ${ASYMPTOTIC_TOLERANCE * 100} % (our threshold; the paper asks only that it be close to 1).` +
        // Derived here: with r21 = r32, ε32 = r^p ε21 by the definition of p, so the ratio reduces to φ1/φ2.
        (Math.abs(g.r21 - g.r32) <= 1e-9 * g.r21 && !g.oscillatory ? ' With one refinement ratio for both pairs the ratio is φ1/φ2 exactly, since p comes from the same three values: it says only that the two finest solutions agree; compare p with the scheme’s formal order as well.' : ''),
      `Report: φ1 = ${numberText(values[0], { digits: 5 })} with a numerical uncertainty of ± ${percentText(g.gci_fine, 2)} (GCI_fine).`,
    ];
    return fieldRecord(
      GCI_FIELDS,
      {
        r21: num(g.r21),
        r32: num(g.r32),
        p: num(g.p),
        phi_ext: quantity(g.phi_ext, first.dims, first.unit?.offset ? undefined : first.unit),
        e_a: shown(g.e_a * 100, '%'),
        e_ext: shown(g.e_ext * 100, '%'),
        gci_fine: shown(g.gci_fine * 100, '%'),
        gci_medium: shown(g.gci_medium * 100, '%'),
        ratio: num(g.ratio),
        asymptotic: bool(g.asymptotic),
        oscillatory: bool(g.oscillatory),
      },
      { warnings, remarks, tag: 'grid convergence' },
    );
  },
};

/** A list of three quantities of one dimension (any), as given. */
function sameDimensionList(args: Args, name: string): { items: Quantity[] } {
  const v = args[name];
  if (v === undefined) throw new TradeError(`missing argument ${name}`);
  const items = v.kind === 'list' ? v.items : [v];
  const qs = items.map((item, i) => {
    if (item.kind !== 'quantity') throw new TradeError(`${name}[${i + 1}] must be a number or quantity, not ${describeValue(item)}`);
    if (item.absolute) throw new TradeError(`${name}[${i + 1}] is a temperature in °C or °F; give it in K, so that relative errors are taken from absolute zero`);
    return item;
  });
  const dims = qs[0]?.dims;
  qs.forEach((q, i) => {
    if (dims && !dimsEqual(q.dims, dims)) throw new TradeError(`${name}[${i + 1}] is in ${unitLabel(q.dims)} but ${name}[1] is in ${unitLabel(dims)}: the three values must share one unit`);
  });
  return { items: qs };
}

export const convergenceEntries: TradeFunction[] = [residuals, monitor, relaxation, gci];
