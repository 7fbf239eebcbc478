/**
 * Makes repeated mnemonics unique by suffixing `:2`, `:3` … to the later ones, comparing
 * without regard to case, as curve names are matched without regard to case.
 */
export const uniqueMnemonics = (mnemonics: readonly string[]): string[] => {
  const taken = new Set(mnemonics.map((name) => name.toUpperCase()));
  const used = new Set<string>();
  return mnemonics.map((name) => {
    let unique = name;
    if (used.has(name.toUpperCase())) {
      let suffix = 2;
      while (taken.has(`${name}:${suffix}`.toUpperCase())) suffix++;
      unique = `${name}:${suffix}`;
    }
    const key = unique.toUpperCase();
    used.add(key);
    taken.add(key);
    return unique;
  });
};
