import { plainDecimal } from "../plain-decimal.js";

const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * The number a LAS token spells (`1500`, `.3665`, `-.5`, `1.2E+03`), or undefined when the token is
 * anything else. Stricter than `Number()`, which also accepts `""`, `0x1F` and `Infinity`.
 */
export const parseLasNumber = (token: string): number | undefined => {
  const plain = plainDecimal(token);
  if (plain === plain) return plain;
  return DECIMAL.test(token) ? Number(token) : undefined;
};
