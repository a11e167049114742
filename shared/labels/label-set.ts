// One set of codes and the words a person reads for each: every state, kind or answer the
// app stores gets its words here, so pages, e-mails, PDFs and CSV files say the same thing.
export interface LabelSet<Code extends string = string> {
  /** What the codes are, for a test's message. */
  title: string;
  codes: readonly Code[];
  labels: Readonly<Record<Code, string>>;
}

export function labelSet<Code extends string>(title: string, codes: readonly Code[], labels: Record<Code, string>): LabelSet<Code> {
  return { title, codes, labels };
}

/** The words for a code; an unknown code reads as "Unknown" rather than leaking the code. */
export function labelOf<Code extends string>(set: LabelSet<Code>, code: string | null | undefined): string {
  return code != null && Object.hasOwn(set.labels, code) ? set.labels[code as Code] : 'Unknown';
}
