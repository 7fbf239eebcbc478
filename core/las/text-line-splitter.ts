export type LineHandler = (text: string, line: number) => void;

export interface LineSplitter {
  push(chunk: string): void;
  /** Hands over the last line (if the text does not end with a line break). */
  end(): void;
}

const BYTE_ORDER_MARK = "\uFEFF";

/**
 * Cuts text arriving in chunks of any size into lines, calling `onLine` with each line (without its
 * break) and its 1-based number. LF, CRLF and a lone CR each end a line, also when a chunk ends
 * between the CR and the LF; a byte-order mark at the very start is dropped.
 */
export const createLineSplitter = (onLine: LineHandler): LineSplitter => {
  let pending = "";
  let lineNumber = 0;
  let atStart = true;
  const emit = (text: string): void => onLine(text, ++lineNumber);

  const push = (chunk: string): void => {
    const scanFrom = Math.max(0, pending.length - 1);
    let text = pending + chunk;
    if (atStart && text.length > 0) {
      atStart = false;
      if (text.startsWith(BYTE_ORDER_MARK)) text = text.slice(1);
    }
    let lineStart = 0;
    for (let i = scanFrom; i < text.length; i++) {
      const char = text.charCodeAt(i);
      if (char === 10) {
        emit(text.slice(lineStart, i));
        lineStart = i + 1;
      } else if (char === 13) {
        if (i + 1 === text.length) break;
        emit(text.slice(lineStart, i));
        if (text.charCodeAt(i + 1) === 10) i++;
        lineStart = i + 1;
      }
    }
    pending = text.slice(lineStart);
  };

  const end = (): void => {
    if (pending.endsWith("\r")) emit(pending.slice(0, -1));
    else if (pending.length > 0) emit(pending);
    pending = "";
  };

  return { push, end };
};
