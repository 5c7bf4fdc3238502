// The dimension labels beside the domain picture: a reader must be able to read each
// distance, so labels that would overlap are spread apart, in the order of the distances
// they name. The spacing rule (13 px at an 11 px font) is project layout, common practice
// for legible labels; the checks are on the order and the gaps, read back from the SVG.
import { describe, expect, it } from 'vitest';
import { domainSvg, type DomainPicture } from '../../server/core/domain/domain-svg.js';

/** y of each right-hand chain label (x beyond the drawing), by its text. */
function chainLabels(svg: string): Array<{ text: string; y: number }> {
  const out: Array<{ text: string; y: number }> = [];
  for (const m of svg.matchAll(/<text x="([\d.]+)" y="([\d.]+)" font-size="11">([^<]+)<\/text>/g)) {
    if (Number(m[1]) > 480) out.push({ text: m[3]!, y: Number(m[2]) });
  }
  return out;
}

// A low body clear of the floor by 50 mm: its "below" and "body H" segments are a pixel or
// two tall, so their labels would sit on top of each other unless spread.
const low: DomainPicture = {
  body: [4, 2, 0.1], upstream: 10, downstream: 30, lateral: 10, top: 10, below: 0.05,
  length: 44, width: 22, height: 10.15, ground: false, rule: 'test', blockage: 0.001,
};

describe('labels of the cross-flow chains', () => {
  it('crowded height labels keep the order of their distances, top to bottom, 13 px apart', () => {
    const labels = chainLabels(domainSvg(low));
    const heights = labels.filter((l) => /^(top|body H|below) /.test(l.text));
    expect(heights.map((l) => l.text)).toEqual(['top 10 m', 'body H 100 mm', 'below 50 mm']);
    expect(heights[1]!.y - heights[0]!.y).toBeGreaterThanOrEqual(13);
    // The two crowded ones are pushed exactly one gap apart, no more.
    expect(heights[2]!.y - heights[1]!.y).toBeCloseTo(13, 6);
  });

  it('labels with room to spare sit at the middle of their segment, not pushed', () => {
    const labels = chainLabels(domainSvg(low));
    const plan = labels.filter((l) => /^(lateral|body W) /.test(l.text));
    expect(plan.map((l) => l.text)).toEqual(['lateral 10 m', 'body W 2 m', 'lateral 10 m']);
    // Equal lateral distances on either side: the body label lies midway between them.
    expect(plan[1]!.y - plan[0]!.y).toBeCloseTo(plan[2]!.y - plan[1]!.y, 1);
    expect(plan[1]!.y - plan[0]!.y).toBeGreaterThan(13);
  });
});
