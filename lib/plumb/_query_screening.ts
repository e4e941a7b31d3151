/**
 * Small helpers for a query source's screenings, shared by the scanned
 * chain (`query_chain.ts`).
 *
 * @module
 */
import type { Analysis } from "../results/analysis.ts";
import type { QueryScreening } from "../results/query_source.ts";

/** A screening with `note` leading its origin's notes and its reading's points. */
export function _withNote(s: QueryScreening, note: string | undefined): QueryScreening {
  if (note === undefined) return s;
  const a = s.analysis;
  const analysis: Analysis = Object.freeze({
    ...a,
    origin: Object.freeze({ ...a.origin, notes: Object.freeze([note, ...(a.origin.notes ?? [])]) }),
    reading: Object.freeze({ ...a.reading, points: Object.freeze([note, ...a.reading.points]) }),
  });
  return { ...s, analysis };
}

/** The one screening of a request, or its refusal thrown. */
export function _single(s: QueryScreening | Error): QueryScreening {
  if (s instanceof Error) throw s;
  return s;
}
