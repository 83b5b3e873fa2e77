/**
 * The one error type of the SEG-2 reader. Every problem with a file — truncation, a wrong
 * block id, a size that does not fit, an unreadable string value — is reported as a
 * `Seg2Error` that names the byte offset where the reader looked and what it expected there.
 */
export class Seg2Error extends Error {
  /** Byte offset from the start of the file where the problem was found. */
  readonly offset: number;
  /** What the reader expected at that offset, in words. */
  readonly expected: string;
  /** What it found instead, in words (omitted when there was nothing to find). */
  readonly found: string | undefined;

  constructor(offset: number, expected: string, found?: string) {
    super(`byte ${offset}: expected ${expected}${found === undefined ? "" : `, found ${found}`}`);
    this.name = "Seg2Error";
    this.offset = offset;
    this.expected = expected;
    this.found = found;
  }
}
