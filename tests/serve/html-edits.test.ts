// The edit finder: which text nodes and attributes changed, found by position
// in document order, and a refusal whenever the node sequence differs. The
// browser side (web/edits.js) is checked against real pages in
// tests/browser/patching.test.ts.
import { describe, expect, it } from 'vitest';
import { decodeEntities, htmlEdits } from '../../server/serve/html-edits.js';

describe('html edits', () => {
  it('finds a changed number by its text node index', () => {
    const edits = htmlEdits('h0', '<p>Re = <b>12</b> at <i>4 m</i></p>', '<p>Re = <b>13</b> at <i>4 m</i></p>');
    // Text nodes in order: "Re = " (0), "12" (1), " at " (2), "4 m" (3).
    expect(edits?.texts).toEqual([[1, '12', '13']]);
    expect(edits?.attrs).toEqual([]);
    expect(edits?.from).toBe('h0');
  });

  it('finds changed, added and removed attributes by element index', () => {
    const before = '<div class="a"><span data-si="1" style="height:1em">x</span><br title="t"></div>';
    const after = '<div class="a"><span data-si="2" lang="en">x</span><br></div>';
    const edits = htmlEdits('h', before, after)!;
    expect(edits.texts).toEqual([]);
    expect(edits.attrs).toEqual([
      [1, 'span', 'data-si', '2'],
      [1, 'span', 'lang', 'en'],
      [1, 'span', 'style', null],
      [2, 'br', 'title', null],
    ]);
  });

  it('reads entities as the parser does, and a ">" inside a quoted value as part of the value', () => {
    expect(decodeEntities('a &lt; b &amp;&amp; c&#x3e;d&#62;&nbsp;')).toBe('a < b && c>d>\u00a0');
    const edits = htmlEdits('h', '<span title="a > b">x &lt; 1</span>', '<span title="a > c">x &lt; 2</span>')!;
    expect(edits.texts).toEqual([[0, 'x < 1', 'x < 2']]);
    expect(edits.attrs).toEqual([[0, 'span', 'title', 'a > c']]);
  });

  it('gives the same shape for markup of the same shape, and another when the shape differs', () => {
    const a = htmlEdits('h', '<p>1</p><p>2</p>', '<p>3</p><p>4</p>')!;
    const b = htmlEdits('h', '<p>5</p><p>6</p>', '<p>5</p><p>6</p>')!;
    const c = htmlEdits('h', '<p>1</p><div>2</div>', '<p>1</p><div>3</div>')!;
    expect(a.shape).toBe(b.shape);
    expect(c.shape).not.toBe(a.shape);
  });

  it('refuses when the node sequence changes', () => {
    expect(htmlEdits('h', '<p>1</p>', '<p>1</p><p>2</p>')).toBeNull(); // a node added
    expect(htmlEdits('h', '<p>1</p><p>2</p>', '<p>1</p>')).toBeNull(); // a node removed
    expect(htmlEdits('h', '<p>1</p>', '<div>1</div>')).toBeNull(); // another element
    expect(htmlEdits('h', '<p>1</p>', '<p><b>1</b></p>')).toBeNull(); // text became an element
    expect(htmlEdits('h', '<p>1</p>x', '<p>1</p>')).toBeNull(); // trailing text gone
  });

  it('refuses markup it cannot be sure the browser reads node for node', () => {
    expect(htmlEdits('h', '<p>1<!-- c --></p>', '<p>2<!-- c --></p>')).toBeNull(); // a comment
    expect(htmlEdits('h', '<p>1 < 2</p>', '<p>1 < 3</p>')).toBeNull(); // a stray "<"
    expect(htmlEdits('h', '<p>&copy; 1</p>', '<p>&copy; 2</p>')).toBeNull(); // an entity it does not know
    expect(htmlEdits('h', '<p title="open>1</p>', '<p title="open>2</p>')).toBeNull(); // a quote left open
  });
});
