/**
 * Makes repeated mnemonics unique by suffixing `:2`, `:3` … to the later ones, comparing
 * without regard to case, as curve names are matched without regard to case.
 */
export const uniqueMnemonics = (mnemonics: readonly string[]): string[] => {
  const taken = new Set(mnemonics.map((name) => name.toUpperCase()));
  const used = new Set<string>();
  // The next suffix to try per name, so a name repeated n times costs O(n), not O(n²).
  const nextSuffix = new Map<string, number>();
  return mnemonics.map((name) => {
    let unique = name;
    const upper = name.toUpperCase();
    if (used.has(upper)) {
      let suffix = nextSuffix.get(upper) ?? 2;
      while (taken.has(`${upper}:${suffix}`)) suffix++;
      nextSuffix.set(upper, suffix + 1);
      unique = `${name}:${suffix}`;
    }
    const key = unique.toUpperCase();
    used.add(key);
    taken.add(key);
    return unique;
  });
};
