/**
 * Reads a pasted lot: one envelope per line, section 1 and section 2 separated by a comma,
 * semicolon, tab or spaces; blank lines and lines starting with # are skipped. Returns the
 * sections, or the first bad line (1-based) with what is wrong.
 *
 * @example parseLot('1.21, 1.18\n1.05 1.12') // { ok: true, sections: [[1.21, 1.18], [1.05, 1.12]] }
 */
export function parseLot(
  text: string,
): { ok: true; sections: [number, number][] } | { ok: false; line: number; message: string } {
  const sections: [number, number][] = [];
  const lines = text.split(/\r?\n/);
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i].trim();
    if (line === '' || line.startsWith('#')) continue;
    const parts = line.split(/[\s,;]+/).filter(Boolean);
    const [a, b] = parts.map(Number);
    if (parts.length !== 2 || !(a > 0) || !(b > 0)) {
      return {
        ok: false,
        line: i + 1,
        message: `line ${i + 1}: two positive numbers (section 1, section 2)`,
      };
    }
    sections.push([a, b]);
  }
  if (sections.length === 0) return { ok: false, line: 0, message: 'no envelope in the lot' };
  return { ok: true, sections };
}
