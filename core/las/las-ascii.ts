/**
 * Generated text made ASCII for a LAS file, which the CWLS LAS 2.0 standard describes as "files written in ASCII":
 * the symbols this service's own descriptions use (dashes, the multiplication dot, degrees, Greek letters of
 * rock physics) spelled out, accented letters without their accents, anything else a question mark.
 */
const SPELLED: Readonly<Record<string, string>> = {
  "\u2010": "-", // hyphen
  "\u2011": "-", // non-breaking hyphen
  "\u2012": "-", // figure dash
  "\u2013": "-", // en dash
  "\u2014": "-", // em dash
  "\u2212": "-", // minus sign
  "\u00b7": "*", // middle dot (multiplication)
  "\u22c5": "*", // dot operator
  "\u00d7": "x",
  "\u00b0": " deg",
  "\u00b2": "^2",
  "\u00b3": "^3",
  "\u221a": "sqrt",
  "\u2264": "<=",
  "\u2265": ">=",
  "\u2248": "~",
  "\u2018": "'",
  "\u2019": "'",
  "\u201c": '"',
  "\u201d": '"',
  "\u2026": "...",
  "\u00a0": " ",
  "\u00b5": "u", // micro sign (µs/ft is us/ft)
  "\u03bc": "mu",
  "\u03c1": "rho",
  "\u03bd": "nu",
  "\u03bb": "lambda",
  "\u03c6": "phi",
  "\u03c3": "sigma",
  "\u0394": "delta",
  "\u00df": "ss",
  "\u00f8": "o",
  "\u00d8": "O",
  "\u00e6": "ae",
  "\u00c6": "AE",
  "\u0142": "l",
  "\u0141": "L",
};

const NOT_ASCII = /[^\x00-\x7f]/gu;
const COMBINING_MARKS = /\p{M}/gu;

const spell = (character: string): string => {
  const spelled = SPELLED[character];
  if (spelled !== undefined) return spelled;
  const bare = character.normalize("NFD").replace(COMBINING_MARKS, "");
  return /^[\x00-\x7f]+$/.test(bare) ? bare : "?";
};

/** `text` with every character outside ASCII spelled in ASCII (see above); ASCII text comes back as it is. */
export const lasAscii = (text: string): string => text.replace(NOT_ASCII, spell);
