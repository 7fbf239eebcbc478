export interface UniqueMnemonicsOptions {
  /** Put between a name and its number: `:` by default (`DT:2`); LAS output uses `_`, as a LAS mnemonic may not hold a colon. */
  separator?: string;
  /** Names held elsewhere (the service's own output curves): a mnemonic equal to one of them is numbered too. */
  reserved?: readonly string[];
}

/**
 * Makes repeated mnemonics unique by suffixing `:2`, `:3` … to the later ones, comparing
 * without regard to case, as curve names are matched without regard to case.
 */
export const uniqueMnemonics = (mnemonics: readonly string[], options: UniqueMnemonicsOptions = {}): string[] => {
  const separator = options.separator ?? ":";
  const reserved = (options.reserved ?? []).map((name) => name.toUpperCase());
  const taken = new Set([...mnemonics.map((name) => name.toUpperCase()), ...reserved]);
  const used = new Set(reserved);
  // The next suffix to try per name, so a name repeated n times costs O(n), not O(n²).
  const nextSuffix = new Map<string, number>();
  return mnemonics.map((name) => {
    let unique = name;
    const upper = name.toUpperCase();
    if (used.has(upper)) {
      let suffix = nextSuffix.get(upper) ?? 2;
      while (taken.has(`${upper}${separator}${suffix}`)) suffix++;
      nextSuffix.set(upper, suffix + 1);
      unique = `${name}${separator}${suffix}`;
    }
    const key = unique.toUpperCase();
    used.add(key);
    taken.add(key);
    return unique;
  });
};
