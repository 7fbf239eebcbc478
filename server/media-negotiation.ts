import { ProblemError } from "./problems.js";

interface MediaRange {
  type: string;
  subtype: string;
  q: number;
}

const parseAccept = (header: string): MediaRange[] =>
  header
    .split(",")
    .map((part) => {
      const [range, ...parameters] = part.trim().split(";");
      const [type = "", subtype = ""] = range.trim().toLowerCase().split("/");
      const q = parameters.map((p) => /^\s*q\s*=\s*([0-9.]+)\s*$/i.exec(p)).find((m) => m !== null);
      return { type, subtype, q: q ? Number(q[1]) : 1 };
    })
    .filter((range) => range.type !== "" && range.subtype !== "" && Number.isFinite(range.q));

/** How well a range matches a media type: exact 3, type/* 2, wildcard 1, no match 0 (RFC 9110 §12.5.1 precedence). */
const specificity = (range: MediaRange, mediaType: string): number => {
  const [type, subtype] = mediaType.split("/");
  if (range.type === type && range.subtype === subtype) return 3;
  if (range.type === type && range.subtype === "*") return 2;
  return range.type === "*" && range.subtype === "*" ? 1 : 0;
};

/**
 * The supported media type an Accept header prefers (RFC 9110 §12.5.1: the most specific matching
 * range gives a type its quality; q=0 refuses it; ties go to the order of `supported`).
 * A missing or empty header accepts the first supported type; undefined means none is acceptable.
 */
export const negotiateMediaType = <T extends string>(header: string | undefined, supported: readonly T[]): T | undefined => {
  if (header === undefined || header.trim() === "") return supported[0];
  const ranges = parseAccept(header);
  let best: { type: T; q: number } | undefined;
  for (const mediaType of supported) {
    let match: MediaRange | undefined;
    let matchSpecificity = 0;
    for (const range of ranges) {
      const s = specificity(range, mediaType);
      if (s > matchSpecificity) {
        match = range;
        matchSpecificity = s;
      }
    }
    if (match !== undefined && match.q > 0 && (best === undefined || match.q > best.q)) best = { type: mediaType, q: match.q };
  }
  return best?.type;
};

/** For endpoints that answer JSON only: a 406 problem when Accept names nothing JSON can satisfy (RFC 9110 §12.5.1). */
export const requireJsonAnswer = (accept: string | undefined): void => {
  if (negotiateMediaType(accept, ["application/json"]) === undefined) {
    throw new ProblemError("not-acceptable", `Accept "${accept}" names no format this endpoint writes: it answers application/json.`);
  }
};
