// Where a finding points: the one position type of the core. It lives here, in the leaf layer,
// so that every layer above (syntax included) can speak of spans without importing upward.

/** Half-open range of UTF-16 code-unit offsets into the document text: [start, end). */
export interface Span {
  readonly start: number;
  readonly end: number;
}
