// Rendered html kept between runs, deflated. A block's html is about 4 kB a
// statement, most of it KaTeX markup, and deflates to under a tenth of that;
// it is unpacked only when a run needs its text (a changed block reusing its
// unchanged statements, or a part read by whoever sends it on). The packed
// bytes are held as a one-byte string, so they stay on the heap the sandbox
// caps and the memory benchmark counts, instead of in a Buffer beside it.
import { deflateRawSync, inflateRawSync } from 'node:zlib';

/** Below this many characters html is kept as it stands: deflating saves little. */
const PACK_FROM = 2048;
const PAST_LATIN1 = /[^\x00-\xff]/u;

export class PackedHtml {
  private constructor(
    /** The html itself, or its deflated bytes one per character. */
    private readonly held: string,
    private readonly packed: boolean,
  ) {}

  static of(html: string): PackedHtml {
    // Compact html is Latin-1 throughout; anything else is kept whole rather than risk a lossy round trip.
    if (html.length < PACK_FROM || PAST_LATIN1.test(html)) return new PackedHtml(html, false);
    return new PackedHtml(deflateRawSync(Buffer.from(html, 'latin1')).toString('latin1'), true);
  }

  /**
   * Equal for equal html (deflate is deterministic), and short: what a
   * receiver keeps to tell whether a part changed since it last sent it.
   */
  get token(): string {
    return this.held;
  }

  /** The html, as a fresh flat string (not kept here). */
  html(): string {
    return this.packed ? inflateRawSync(Buffer.from(this.held, 'latin1')).toString('latin1') : this.held;
  }
}
