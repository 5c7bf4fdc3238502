// Registry entry for the y+ report: reads the wall samples a solver run
// exported, summarises them against the target band and scales the first
// layer for the next mesh.
import { figure, optionalSi, num, record, shown, si, siArg, siListArg, stringArg } from '../build.js';
import { TradeError, type TradeFunction } from '../registry.js';
import type { Value } from '../values.js';
import { guarded } from './args.js';
import { bandOf, wallTreatment } from './first-cell.js';
import { histogramSvg } from './histogram-svg.js';
import { sig3 } from './svg.js';
import { readWallSamples } from './wall-csv.js';
import { correctedFirst, yplusStats } from './yplus-report.js';

/** Share of the wall a run should have inside its band (common practice: most of it). */
const IN_BAND_AIM = 0.9;

export const yplus_report: TradeFunction = {
  name: 'yplus_report',
  params: [
    { name: 'path', type: 'string', doc: 'CSV of wall samples, relative to the project folder (header row; comma, semicolon or tab)' },
    { name: 'column', type: 'string', default: '"yplus"', doc: 'column holding y+' },
    { name: 'weight', type: 'string', default: '"area"', doc: 'column of face weights (area); used when present, "none" for equal weights' },
    { name: 'target', type: 'quantity', unit: '1', default: '1', doc: 'the y+ the mesh aims at' },
    { name: 'band', type: 'list', unit: '1', default: '[0.5, 5]', doc: 'accepted y+ range [low, high]' },
    { name: 'first', type: 'quantity', unit: 'm', optional: true, doc: 'first-layer height of the run, for corrected_first' },
  ],
  doc: 'y+ statistics of a run: count, min, max, mean, weighted_mean, p05, p50, p95, in_band, corrected_first',
  source: 'area-weighted mean and share; percentiles by Hyndman & Fan (1996) definition 7; corrected_first = first × target / weighted mean',
  example: 'yplus_report("data/van-yplus.csv", first: 40 um)',
  compute: guarded((args, ctx) => {
    const path = stringArg(args, 'path');
    const column = stringArg(args, 'column');
    const weightName = stringArg(args, 'weight');
    const target = siArg(args, 'target');
    const bandList = siListArg(args, 'band');
    if (bandList.length !== 2 || !(bandList[0]! < bandList[1]!)) throw new TradeError('band must be a list of two numbers, low then high, e.g. [0.5, 5]');
    if (!(target > 0)) throw new TradeError('target must be a positive y+');
    const band: [number, number] = [bandList[0]!, bandList[1]!];
    const first = optionalSi(args, 'first', 'm');
    if (first !== undefined && !(first > 0)) throw new TradeError('first must be a positive length');

    const weight = weightName === '' || weightName.toLowerCase() === 'none' ? undefined : weightName;
    const samples = readWallSamples(ctx.readData(path), column, weight);
    const st = yplusStats(samples.values, samples.weights, band);
    const fields: Array<[string, Value, string?]> = [
      ['count', num(st.count), 'wall faces'],
      ['min', num(st.min), 'lowest y+'],
      ['max', num(st.max), 'highest y+'],
      ['mean', num(st.mean), 'mean over faces'],
      ['weighted_mean', num(st.weighted_mean), samples.weighted ? `mean weighted by ${weight}` : 'no weight column: same as mean'],
      ['p05', num(st.p05), '5th percentile'],
      ['p50', num(st.p50), 'median'],
      ['p95', num(st.p95), '95th percentile'],
      ['in_band', shown(st.in_band * 100, '%'), `share within ${sig3(band[0])}–${sig3(band[1])}`],
    ];
    if (first !== undefined) fields.push(['corrected_first', si(correctedFirst(first, target, st.weighted_mean), 'm'), 'next first-layer height']);

    const share = samples.weighted ? 'of the wall area' : 'of the faces';
    const warnings: string[] = [];
    if (st.in_band < IN_BAND_AIM) {
      warnings.push(`only ${sig3(st.in_band * 100)} % ${share} has y+ inside ${sig3(band[0])}–${sig3(band[1])}; most of the wall, about ${IN_BAND_AIM * 100} % or more, is usual (common practice).`);
    }
    const aim = bandOf(target);
    const seen = bandOf(st.weighted_mean);
    if (seen !== aim) warnings.push(`the mean y+ ${sig3(st.weighted_mean)} lies in the ${seen}, not in the ${aim} the target ${sig3(target)} aims at.`);

    const remarks = [
      `Target y+ ${sig3(target)}: ${aim}. ${wallTreatment(aim)}`,
      `p05, p50 and p95 count faces (Hyndman & Fan 1996, definition 7); weighted_mean and in_band weigh each face${samples.weighted ? ` by ${weight}` : ''}.`,
    ];
    if (weight && !samples.weighted) remarks.push(`The file has no column ${weight}, so every face counts equally.`);
    remarks.push(
      first === undefined
        ? 'Pass first: (the first-layer height of this run) to get corrected_first.'
        : 'corrected_first = first × target / weighted_mean; meeting a y+ target is iterative, so re-run and report again.',
    );
    return record(fields, {
      warnings,
      remarks,
      figure: figure(histogramSvg({ values: samples.values, weights: samples.weights, weighted: samples.weighted, band, target }), `y+ histogram from ${path}`),
      tag: 'y+ report',
    });
  }),
};
